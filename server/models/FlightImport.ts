import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { ImportFailure, ImportParams, ImportProgress, ImportStatus, SourceFormat } from '../../shared/types/flight.js'

/** One upload or re-import job: status and progress, kept whether or not a flight results. */
export class FlightImport extends Model<InferAttributes<FlightImport>, InferCreationAttributes<FlightImport>> {
  declare id: CreationOptional<number>
  declare flightId: number
  declare teamId: number
  declare createdBy: number | null
  declare kind: 'create' | 'reimport'
  declare status: CreationOptional<ImportStatus>
  declare failure: CreationOptional<ImportFailure | null>
  declare progress: CreationOptional<ImportProgress>
  declare params: ImportParams
  declare tempFile: string | null
  declare sourceFormat: SourceFormat
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    FlightImport.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        flightId: { type: DataTypes.INTEGER, allowNull: false },
        teamId: { type: DataTypes.INTEGER, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        kind: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'queued' },
        failure: { type: DataTypes.JSONB, allowNull: true },
        progress: { type: DataTypes.JSONB, allowNull: false, defaultValue: { bytesDone: 0, bytesTotal: 0, rowsDone: 0 } },
        params: { type: DataTypes.JSONB, allowNull: false },
        tempFile: { type: DataTypes.TEXT, allowNull: true },
        sourceFormat: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'imports', underscored: true },
    )
  }
}
