import type { QueryInterface } from 'sequelize'
import type * as S from 'sequelize'

export async function up(qi: QueryInterface, Sequelize: typeof S): Promise<void> {
  await qi.createTable('link_setups', {
    id: { type: Sequelize.INTEGER, primaryKey: true, autoIncrement: true },
    team_id: { type: Sequelize.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    created_by: { type: Sequelize.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    lineage_id: { type: Sequelize.INTEGER, allowNull: false },
    version: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
    is_current: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: true },
    name: { type: Sequelize.TEXT, allowNull: false },
    band: { type: Sequelize.TEXT, allowNull: false },
    freq_mhz: { type: Sequelize.DOUBLE, allowNull: false },
    channel: { type: Sequelize.TEXT, allowNull: true },
    tx_power_dbm: { type: Sequelize.DOUBLE, allowNull: false },
    tx_antenna: { type: Sequelize.JSONB, allowNull: false },
    rx_antennas: { type: Sequelize.JSONB, allowNull: false },
    cable_loss_db: { type: Sequelize.DOUBLE, allowNull: false, defaultValue: 0 },
    sensitivity_dbm: { type: Sequelize.DOUBLE, allowNull: false },
    floor_dbm: { type: Sequelize.DOUBLE, allowNull: true },
    notes: { type: Sequelize.TEXT, allowNull: false, defaultValue: '' },
    created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
  })
  await qi.addIndex('link_setups', ['team_id', 'is_current'])
  await qi.addIndex('link_setups', ['lineage_id', 'version'], { unique: true })
  // one current version per lineage
  await qi.sequelize.query(`CREATE UNIQUE INDEX link_setups_one_current ON link_setups (lineage_id) WHERE is_current`)
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('link_setups')
}
