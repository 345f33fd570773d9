import type { Sequelize } from 'sequelize'
import { Team } from './Team.js'
import { User } from './User.js'
import { Membership } from './Membership.js'
import { Invite } from './Invite.js'
import { PasswordReset } from './PasswordReset.js'
import { OutgoingMail } from './OutgoingMail.js'
import { Course } from './Course.js'
import { CourseTerrain } from './CourseTerrain.js'
import { LinkSetup } from './LinkSetup.js'
import { Comparison } from './Comparison.js'
import { Flight } from './Flight.js'
import { FlightImport } from './FlightImport.js'
import { ColumnMapping } from './ColumnMapping.js'

/** Initialises every model and its associations; each feature adds its init call here. */
export function initModels(sequelize: Sequelize): void {
  Team.initModel(sequelize)
  User.initModel(sequelize)
  Membership.initModel(sequelize)
  Invite.initModel(sequelize)
  PasswordReset.initModel(sequelize)
  OutgoingMail.initModel(sequelize)
  Course.initModel(sequelize)
  CourseTerrain.initModel(sequelize)
  LinkSetup.initModel(sequelize)
  Comparison.initModel(sequelize)
  Flight.initModel(sequelize)
  FlightImport.initModel(sequelize)
  ColumnMapping.initModel(sequelize)

  Membership.belongsTo(User, { as: 'user', foreignKey: 'userId' })
  Membership.belongsTo(Team, { as: 'team', foreignKey: 'teamId' })
  User.hasMany(Membership, { as: 'memberships', foreignKey: 'userId' })
  Team.hasMany(Membership, { as: 'memberships', foreignKey: 'teamId' })
  Invite.belongsTo(Team, { as: 'team', foreignKey: 'teamId' })
}
