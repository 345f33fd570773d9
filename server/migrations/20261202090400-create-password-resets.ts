import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('password_resets', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    token_hash: { type: Sequelize.TEXT, allowNull: false, unique: true },
    expires_at: { type: Sequelize.DATE, allowNull: false },
    used_at: { type: Sequelize.DATE, allowNull: true },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.addIndex('password_resets', ['user_id'], { name: 'password_resets_user' })
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('password_resets')
}
