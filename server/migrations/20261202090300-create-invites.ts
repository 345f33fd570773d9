import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('invites', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    team_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: Sequelize.TEXT, allowNull: false },
    role: { type: Sequelize.TEXT, allowNull: false },
    token_hash: { type: Sequelize.TEXT, allowNull: false, unique: true },
    expires_at: { type: Sequelize.DATE, allowNull: false },
    accepted_at: { type: Sequelize.DATE, allowNull: true },
    invited_by: { type: Sequelize.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.addIndex('invites', ['team_id'], { name: 'invites_team' })
  await qi.sequelize.query(
    `ALTER TABLE invites ADD CONSTRAINT invites_role_check CHECK (role IN ('admin', 'instructor', 'pilot', 'viewer'))`,
  )
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('invites')
}
