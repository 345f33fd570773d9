import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

/** A saved comparison: flights in order, the baseline among them, the fade margin, a name and a conclusion. */
export class Comparison extends Model<InferAttributes<Comparison>, InferCreationAttributes<Comparison>> {
  declare id: CreationOptional<number>
  declare teamId: number
  declare createdBy: number | null
  declare name: string
  declare conclusion: CreationOptional<string>
  declare flightIds: number[]
  declare baselineId: number
  declare fadeMarginDb: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Comparison.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        teamId: { type: DataTypes.INTEGER, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        conclusion: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        flightIds: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false },
        baselineId: { type: DataTypes.INTEGER, allowNull: false },
        fadeMarginDb: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 10 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'comparisons', underscored: true },
    )
  }
}
