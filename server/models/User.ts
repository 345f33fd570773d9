import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { UnitSystem } from '../../shared/types/api.js'

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>
  declare email: string
  declare name: string
  declare passwordHash: string
  declare units: CreationOptional<UnitSystem>
  declare currentTeamId: number | null
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        email: { type: DataTypes.TEXT, allowNull: false, unique: true },
        name: { type: DataTypes.TEXT, allowNull: false, validate: { len: [1, 100] } },
        passwordHash: { type: DataTypes.TEXT, allowNull: false },
        units: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'metric', validate: { isIn: [['metric', 'imperial']] } },
        currentTeamId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', underscored: true, updatedAt: false },
    )
  }
}
