import type { QueryInterface } from 'sequelize'

// Raw SQL: samples are written by COPY and read by hand-written queries, never through a model.
export async function up(qi: QueryInterface): Promise<void> {
  await qi.sequelize.query(`
    CREATE TABLE samples (
      flight_id integer NOT NULL REFERENCES flights(id) ON DELETE CASCADE,
      seq integer NOT NULL,
      t_ms bigint NOT NULL,
      lat double precision NOT NULL,
      lon double precision NOT NULL,
      alt_m real,
      rssi1_dbm real,
      rssi2_dbm real,
      lq real,
      snr real,
      dist_m real,
      extras jsonb,
      PRIMARY KEY (flight_id, seq)
    )`)
  await qi.sequelize.query(`CREATE INDEX samples_flight_time ON samples (flight_id, t_ms)`)
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('samples')
}
