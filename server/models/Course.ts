import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { CourseObstacle, RouteLineString } from '../../shared/types/course.js'

/** A test site: the ground station, its antenna height, the planned route and obstacles. */
export class Course extends Model<InferAttributes<Course>, InferCreationAttributes<Course>> {
  declare id: CreationOptional<number>
  declare teamId: number
  declare createdBy: number | null
  declare name: string
  declare notes: CreationOptional<string>
  declare stationLat: number
  declare stationLon: number
  declare antennaHeightM: CreationOptional<number>
  declare groundElevM: CreationOptional<number>
  declare route: RouteLineString | null
  declare obstacles: CreationOptional<CourseObstacle[]>
  declare terrainId: CreationOptional<number | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Course.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        teamId: { type: DataTypes.INTEGER, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        stationLat: { type: DataTypes.DOUBLE, allowNull: false, validate: { min: -90, max: 90 } },
        stationLon: { type: DataTypes.DOUBLE, allowNull: false, validate: { min: -180, max: 180 } },
        antennaHeightM: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 2 },
        groundElevM: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        route: { type: DataTypes.JSONB, allowNull: true },
        obstacles: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        terrainId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'courses', underscored: true },
    )
  }
}
