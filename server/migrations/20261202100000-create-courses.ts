import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('courses', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    team_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    created_by: { type: Sequelize.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    name: { type: Sequelize.TEXT, allowNull: false },
    notes: { type: Sequelize.TEXT, allowNull: false, defaultValue: '' },
    station_lat: { type: Sequelize.DOUBLE, allowNull: false },
    station_lon: { type: Sequelize.DOUBLE, allowNull: false },
    antenna_height_m: { type: Sequelize.DOUBLE, allowNull: false, defaultValue: 2 },
    ground_elev_m: { type: Sequelize.DOUBLE, allowNull: false, defaultValue: 0 },
    route: { type: Sequelize.JSONB, allowNull: true },
    obstacles: { type: Sequelize.JSONB, allowNull: false, defaultValue: [] },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.addIndex('courses', ['team_id', 'name'])
  await qi.sequelize.query(
    `ALTER TABLE courses ADD CONSTRAINT courses_station_range CHECK (station_lat BETWEEN -90 AND 90 AND station_lon BETWEEN -180 AND 180)`,
  )
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('courses')
}
