import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('memberships', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    team_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    role: { type: Sequelize.TEXT, allowNull: false },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.addIndex('memberships', ['user_id', 'team_id'], { unique: true, name: 'memberships_user_team' })
  await qi.addIndex('memberships', ['team_id'], { name: 'memberships_team' })
  await qi.sequelize.query(
    `ALTER TABLE memberships ADD CONSTRAINT memberships_role_check CHECK (role IN ('admin', 'instructor', 'pilot', 'viewer'))`,
  )
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('memberships')
}
