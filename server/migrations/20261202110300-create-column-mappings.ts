import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('column_mappings', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    team_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    created_by: { type: Sequelize.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    name: { type: Sequelize.TEXT, allowNull: false },
    header_signature: { type: Sequelize.TEXT, allowNull: false },
    mapping: { type: Sequelize.JSONB, allowNull: false },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.addConstraint('column_mappings', { type: 'unique', fields: ['team_id', 'name'], name: 'column_mappings_team_name' })
  await qi.addIndex('column_mappings', ['team_id', 'header_signature'])
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('column_mappings')
}
