import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

export class Team extends Model<InferAttributes<Team>, InferCreationAttributes<Team>> {
  declare id: CreationOptional<number>
  declare name: string
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Team.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.TEXT, allowNull: false, validate: { len: [1, 100] } },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'teams', underscored: true, updatedAt: false },
    )
  }
}
