import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('users', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    email: { type: Sequelize.TEXT, allowNull: false, unique: true },
    name: { type: Sequelize.TEXT, allowNull: false },
    password_hash: { type: Sequelize.TEXT, allowNull: false },
    units: { type: Sequelize.TEXT, allowNull: false, defaultValue: 'metric' },
    current_team_id: {
      type: Sequelize.INTEGER,
      allowNull: true,
      references: { model: 'teams', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  // E-mail is stored lower-cased so the plain unique index is case-insensitive in effect.
  await qi.sequelize.query(`ALTER TABLE users ADD CONSTRAINT users_email_lower CHECK (email = lower(email))`)
  await qi.sequelize.query(`ALTER TABLE users ADD CONSTRAINT users_units_check CHECK (units IN ('metric', 'imperial'))`)
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('users')
}
