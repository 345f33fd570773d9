// Inserts a bare flight row pointing at a course and a setup, so "in use" rules can be tested from the
// courses/setups suites. When the flights migration is not there yet, a minimal stand-in table is made
// and dropped again after the suite.
import { pgPool } from '../../server/db.js'

let createdStandIn = false

/** Makes sure a flights table exists; returns a cleanup that drops a stand-in if one was made. */
export async function ensureFlightsTable(): Promise<() => Promise<void>> {
  const { rows } = await pgPool().query<{ t: string | null }>(`SELECT to_regclass('flights')::text AS t`)
  if (!rows[0]?.t) {
    await pgPool().query(`CREATE TABLE flights (
      id serial PRIMARY KEY, team_id int NOT NULL, course_id int NOT NULL REFERENCES courses(id) ON DELETE RESTRICT,
      setup_id int NOT NULL REFERENCES link_setups(id) ON DELETE RESTRICT, created_by int, name text NOT NULL,
      flown_on date NOT NULL, status text NOT NULL DEFAULT 'ready')`)
    createdStandIn = true
  }
  return async () => {
    if (createdStandIn) await pgPool().query('DROP TABLE IF EXISTS flights')
    createdStandIn = false
  }
}

/** Inserts a flight of a team that flew `courseId` with `setupId`; returns its id. */
export async function insertFlight(teamId: number, courseId: number, setupId: number, userId: number): Promise<number> {
  const { rows } = await pgPool().query<{ id: number }>(
    `INSERT INTO flights (team_id, course_id, setup_id, created_by, name, flown_on, status)
     VALUES ($1, $2, $3, $4, 'test flight', CURRENT_DATE, 'ready') RETURNING id`,
    [teamId, courseId, setupId, userId],
  )
  return rows[0]!.id
}
