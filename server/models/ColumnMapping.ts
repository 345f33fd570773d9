import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { ColumnMapping as Mapping } from '../../shared/import/mapping.js'

/** A team's saved column mapping, proposed again for files with the same header signature. */
export class ColumnMapping extends Model<InferAttributes<ColumnMapping>, InferCreationAttributes<ColumnMapping>> {
  declare id: CreationOptional<number>
  declare teamId: number
  declare createdBy: number | null
  declare name: string
  declare headerSignature: string
  declare mapping: Mapping
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    ColumnMapping.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        teamId: { type: DataTypes.INTEGER, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        headerSignature: { type: DataTypes.TEXT, allowNull: false },
        mapping: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'column_mappings', underscored: true },
    )
  }
}
