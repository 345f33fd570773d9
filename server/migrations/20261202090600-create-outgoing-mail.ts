import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('outgoing_mail', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    to: { type: Sequelize.TEXT, allowNull: false },
    subject: { type: Sequelize.TEXT, allowNull: false },
    text: { type: Sequelize.TEXT, allowNull: false },
    html: { type: Sequelize.TEXT, allowNull: true },
    received_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    via: { type: Sequelize.TEXT, allowNull: false },
  })
  await qi.addIndex('outgoing_mail', ['received_at'], { name: 'outgoing_mail_received' })
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('outgoing_mail')
}
