import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize'
import type { Role } from '../../shared/types/api.js'
import type { Team } from './Team.js'
import type { User } from './User.js'

export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
  declare id: CreationOptional<number>
  declare userId: number
  declare teamId: number
  declare role: Role
  declare createdAt: CreationOptional<Date>
  declare user?: NonAttribute<User>
  declare team?: NonAttribute<Team>

  static initModel(sequelize: Sequelize): void {
    Membership.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        teamId: { type: DataTypes.INTEGER, allowNull: false },
        role: { type: DataTypes.TEXT, allowNull: false, validate: { isIn: [['admin', 'instructor', 'pilot', 'viewer']] } },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'memberships', underscored: true, updatedAt: false },
    )
  }
}
