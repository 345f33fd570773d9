import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

// One row per upload or re-import: the job's status and progress before (and whether) a flight exists.
export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('imports', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    flight_id: { type: Sequelize.INTEGER, allowNull: false },
    team_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    created_by: { type: Sequelize.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    kind: { type: Sequelize.TEXT, allowNull: false, defaultValue: 'create' },
    status: { type: Sequelize.TEXT, allowNull: false, defaultValue: 'queued' },
    failure: { type: Sequelize.JSONB, allowNull: true },
    progress: { type: Sequelize.JSONB, allowNull: false, defaultValue: { bytesDone: 0, bytesTotal: 0, rowsDone: 0 } },
    params: { type: Sequelize.JSONB, allowNull: false },
    temp_file: { type: Sequelize.TEXT, allowNull: true },
    source_format: { type: Sequelize.TEXT, allowNull: false },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.addIndex('imports', ['flight_id'])
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('imports')
}
