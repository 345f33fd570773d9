import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { ColumnMapping } from '../../shared/import/mapping.js'
import type { RowReportDto } from '../../shared/import/rowReport.js'
import type { FlightStatus, ImportProgress, SourceFormat } from '../../shared/types/flight.js'

/** One stored flight; it exists only once its samples are committed. */
export class Flight extends Model<InferAttributes<Flight>, InferCreationAttributes<Flight>> {
  declare id: CreationOptional<number>
  declare teamId: number
  declare courseId: number
  declare setupId: number
  declare createdBy: number | null
  declare name: string
  declare flownOn: string
  declare notes: CreationOptional<string>
  declare status: CreationOptional<FlightStatus>
  declare failureReason: CreationOptional<string | null>
  declare progress: CreationOptional<ImportProgress | null>
  declare rowCount: CreationOptional<number>
  declare badRowCount: CreationOptional<number>
  declare rowErrors: CreationOptional<RowReportDto | null>
  declare mapping: CreationOptional<ColumnMapping | null>
  declare rawFile: CreationOptional<string | null>
  declare sourceFormat: CreationOptional<SourceFormat>
  declare analysis: CreationOptional<object | null>
  declare analysisVersion: CreationOptional<string | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Flight.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        teamId: { type: DataTypes.INTEGER, allowNull: false },
        courseId: { type: DataTypes.INTEGER, allowNull: false },
        setupId: { type: DataTypes.INTEGER, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        flownOn: { type: DataTypes.DATEONLY, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'analysing' },
        failureReason: { type: DataTypes.TEXT, allowNull: true },
        progress: { type: DataTypes.JSONB, allowNull: true },
        rowCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        badRowCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        rowErrors: { type: DataTypes.JSONB, allowNull: true },
        mapping: { type: DataTypes.JSONB, allowNull: true },
        rawFile: { type: DataTypes.TEXT, allowNull: true },
        sourceFormat: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'delimited' },
        analysis: { type: DataTypes.JSONB, allowNull: true },
        analysisVersion: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'flights', underscored: true },
    )
  }
}
