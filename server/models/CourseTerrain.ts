import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { TerrainFormat } from '../../shared/types/course.js'

/** An elevation grid uploaded for a course: Float32 LE, row-major, north row first. */
export class CourseTerrain extends Model<InferAttributes<CourseTerrain>, InferCreationAttributes<CourseTerrain>> {
  declare id: CreationOptional<number>
  declare courseId: number
  declare format: TerrainFormat
  declare fileName: string
  declare width: number
  declare height: number
  declare west: number
  declare south: number
  declare east: number
  declare north: number
  declare minElevM: number
  declare maxElevM: number
  declare elevations: Buffer
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    CourseTerrain.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        courseId: { type: DataTypes.INTEGER, allowNull: false },
        format: { type: DataTypes.TEXT, allowNull: false, validate: { isIn: [['geotiff', 'hgt']] } },
        fileName: { type: DataTypes.TEXT, allowNull: false },
        width: { type: DataTypes.INTEGER, allowNull: false },
        height: { type: DataTypes.INTEGER, allowNull: false },
        west: { type: DataTypes.DOUBLE, allowNull: false },
        south: { type: DataTypes.DOUBLE, allowNull: false },
        east: { type: DataTypes.DOUBLE, allowNull: false },
        north: { type: DataTypes.DOUBLE, allowNull: false },
        minElevM: { type: DataTypes.DOUBLE, allowNull: false },
        maxElevM: { type: DataTypes.DOUBLE, allowNull: false },
        elevations: { type: DataTypes.BLOB, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'course_terrains', underscored: true, updatedAt: false },
    )
  }
}
