import path from 'node:path'
import { ROOT } from './run.mjs'
import { ensureCluster, stopCluster } from './pg.mjs'

/** The dev/production database: DATABASE_URL when set, else the project's own cluster in .data/pg. */
export function devDatabase() {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, stop: () => {} }
  const dataDir = path.join(ROOT, '.data', 'pg')
  const port = Number(process.env.PG_PORT ?? 55432)
  const { url, started, dataDir: used } = ensureCluster({ dataDir, port, database: 'ellipsoid' })
  // Leave a cluster that someone else started (another npm start, npm run dev) running.
  return { url, stop: () => started && stopCluster(used) }
}

/** The test database: TEST_DATABASE_URL when set, else a separate cluster in .data/pg-test, recreated empty. */
export function testDatabase() {
  if (process.env.TEST_DATABASE_URL) return { url: process.env.TEST_DATABASE_URL, stop: () => {} }
  const dataDir = path.join(ROOT, '.data', 'pg-test')
  const port = Number(process.env.PG_TEST_PORT ?? 55433)
  const { url, started, dataDir: used } = ensureCluster({ dataDir, port, database: 'ellipsoid_test', fresh: true })
  return { url, stop: () => started && stopCluster(used) }
}
