import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

// Sign-in attempt counters live in PostgreSQL so every instance shares them.
export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('login_throttles', {
    key: { type: Sequelize.TEXT, primaryKey: true },
    attempts: { type: Sequelize.INTEGER, allowNull: false },
    window_start: { type: Sequelize.DATE, allowNull: false },
  })
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('login_throttles')
}
