import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize'
import type { Role } from '../../shared/types/api.js'
import type { Team } from './Team.js'

export class Invite extends Model<InferAttributes<Invite>, InferCreationAttributes<Invite>> {
  declare id: CreationOptional<number>
  declare teamId: number
  declare email: string
  declare role: Role
  declare tokenHash: string
  declare expiresAt: Date
  declare acceptedAt: Date | null
  declare invitedBy: number | null
  declare createdAt: CreationOptional<Date>
  declare team?: NonAttribute<Team>

  static initModel(sequelize: Sequelize): void {
    Invite.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        teamId: { type: DataTypes.INTEGER, allowNull: false },
        email: { type: DataTypes.TEXT, allowNull: false },
        role: { type: DataTypes.TEXT, allowNull: false, validate: { isIn: [['admin', 'instructor', 'pilot', 'viewer']] } },
        tokenHash: { type: DataTypes.TEXT, allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        invitedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invites', underscored: true, updatedAt: false },
    )
  }
}
