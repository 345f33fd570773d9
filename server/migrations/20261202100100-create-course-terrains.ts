import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('course_terrains', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    course_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'courses', key: 'id' }, onDelete: 'CASCADE' },
    format: { type: Sequelize.TEXT, allowNull: false },
    file_name: { type: Sequelize.TEXT, allowNull: false },
    width: { type: Sequelize.INTEGER, allowNull: false },
    height: { type: Sequelize.INTEGER, allowNull: false },
    west: { type: Sequelize.DOUBLE, allowNull: false },
    south: { type: Sequelize.DOUBLE, allowNull: false },
    east: { type: Sequelize.DOUBLE, allowNull: false },
    north: { type: Sequelize.DOUBLE, allowNull: false },
    min_elev_m: { type: Sequelize.DOUBLE, allowNull: false },
    max_elev_m: { type: Sequelize.DOUBLE, allowNull: false },
    // Float32 little-endian, row-major, north row first; NaN where the source had no data
    elevations: { type: Sequelize.BLOB, allowNull: false },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.addIndex('course_terrains', ['course_id'])
  await qi.sequelize.query(`ALTER TABLE course_terrains ADD CONSTRAINT course_terrains_format CHECK (format IN ('geotiff', 'hgt'))`)
  await qi.addColumn('courses', 'terrain_id', {
    type: Sequelize.INTEGER,
    allowNull: true,
    references: { model: 'course_terrains', key: 'id' },
    onDelete: 'SET NULL',
  })
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.removeColumn('courses', 'terrain_id')
  await qi.dropTable('course_terrains')
}
