import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { RxAntenna, TxAntenna } from '../../shared/types/setup.js'

/** One version of a link setup; versions of one setup share lineageId (the first version's id). */
export class LinkSetup extends Model<InferAttributes<LinkSetup>, InferCreationAttributes<LinkSetup>> {
  declare id: CreationOptional<number>
  declare teamId: number
  declare createdBy: number | null
  declare lineageId: number
  declare version: number
  declare isCurrent: boolean
  declare name: string
  declare band: string
  declare freqMhz: number
  declare channel: string | null
  declare txPowerDbm: number
  declare txAntenna: TxAntenna
  declare rxAntennas: RxAntenna[]
  declare cableLossDb: number
  declare sensitivityDbm: number
  declare floorDbm: number | null
  declare notes: string
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    LinkSetup.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        teamId: { type: DataTypes.INTEGER, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        lineageId: { type: DataTypes.INTEGER, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false },
        isCurrent: { type: DataTypes.BOOLEAN, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        band: { type: DataTypes.TEXT, allowNull: false },
        freqMhz: { type: DataTypes.DOUBLE, allowNull: false },
        channel: { type: DataTypes.TEXT, allowNull: true },
        txPowerDbm: { type: DataTypes.DOUBLE, allowNull: false },
        txAntenna: { type: DataTypes.JSONB, allowNull: false },
        rxAntennas: { type: DataTypes.JSONB, allowNull: false },
        cableLossDb: { type: DataTypes.DOUBLE, allowNull: false },
        sensitivityDbm: { type: DataTypes.DOUBLE, allowNull: false },
        floorDbm: { type: DataTypes.DOUBLE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'link_setups', underscored: true, updatedAt: false },
    )
  }
}
