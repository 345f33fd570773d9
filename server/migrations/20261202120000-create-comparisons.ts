import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

// Saved comparisons keep the choice of flights (ids in order) and baseline; results are recomputed on open.
export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('comparisons', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    team_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    created_by: { type: Sequelize.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    name: { type: Sequelize.TEXT, allowNull: false },
    conclusion: { type: Sequelize.TEXT, allowNull: false, defaultValue: '' },
    flight_ids: { type: Sequelize.ARRAY(Sequelize.INTEGER), allowNull: false },
    baseline_id: { type: Sequelize.INTEGER, allowNull: false },
    fade_margin_db: { type: Sequelize.DOUBLE, allowNull: false, defaultValue: 10 },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    updated_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.sequelize.query(
    `ALTER TABLE comparisons ADD CONSTRAINT comparisons_flights_check
       CHECK (cardinality(flight_ids) BETWEEN 2 AND 6 AND baseline_id = ANY(flight_ids))`,
  )
  await qi.addIndex('comparisons', ['team_id', 'updated_at'])
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('comparisons')
}
