import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('flights', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    team_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    course_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'courses', key: 'id' }, onDelete: 'RESTRICT' },
    setup_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'link_setups', key: 'id' }, onDelete: 'RESTRICT' },
    created_by: { type: Sequelize.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    name: { type: Sequelize.TEXT, allowNull: false },
    flown_on: { type: Sequelize.DATEONLY, allowNull: false },
    notes: { type: Sequelize.TEXT, allowNull: false, defaultValue: '' },
    status: { type: Sequelize.TEXT, allowNull: false, defaultValue: 'analysing' },
    failure_reason: { type: Sequelize.TEXT, allowNull: true },
    progress: { type: Sequelize.JSONB, allowNull: true },
    row_count: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
    bad_row_count: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
    row_errors: { type: Sequelize.JSONB, allowNull: true },
    mapping: { type: Sequelize.JSONB, allowNull: true },
    raw_file: { type: Sequelize.TEXT, allowNull: true },
    source_format: { type: Sequelize.TEXT, allowNull: false, defaultValue: 'delimited' },
    analysis: { type: Sequelize.JSONB, allowNull: true },
    analysis_version: { type: Sequelize.TEXT, allowNull: true },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.sequelize.query(
    `ALTER TABLE flights ADD CONSTRAINT flights_status_check CHECK (status IN ('queued','importing','analysing','ready','failed')),
     ADD CONSTRAINT flights_source_format_check CHECK (source_format IN ('delimited','gpx'))`,
  )
  await qi.addIndex('flights', ['team_id', 'flown_on'])
  await qi.addIndex('flights', ['course_id'])
  await qi.addIndex('flights', ['setup_id'])
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('flights')
}
