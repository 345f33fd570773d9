import type { QueryInterface } from 'sequelize'

// One ready-made, decimated overview of each flight's samples, written at import and analysis time so the flight
// screen never scans the whole flight. Raw SQL like samples: written and read by hand-written queries.
export async function up(qi: QueryInterface): Promise<void> {
  await qi.sequelize.query(`
    CREATE TABLE flight_overviews (
      flight_id integer PRIMARY KEY REFERENCES flights(id) ON DELETE CASCADE,
      format_version integer NOT NULL,
      sample_count integer NOT NULL,
      data json NOT NULL,
      built_at timestamptz NOT NULL DEFAULT now()
    )`)
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('flight_overviews')
}
