import fs from 'node:fs'
import path from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import pg from 'pg'
import { Sequelize, type QueryInterface } from 'sequelize'
import { Umzug, SequelizeStorage } from 'umzug'
import { config } from './config.js'
import { logger } from './logger.js'
import { initModels } from './models/index.js'

let seq: Sequelize | null = null
let pool: pg.Pool | null = null

/** The process-wide Sequelize instance with every model initialised. */
export function sequelize(): Sequelize {
  if (seq) return seq
  seq = new Sequelize(config().databaseUrl, {
    dialect: 'postgres',
    logging: false,
    pool: { max: 8, min: 0, acquire: 30_000, idle: 10_000 },
  })
  initModels(seq)
  return seq
}

/**
 * A plain pg pool for the session store and COPY streams. The error listener keeps a database
 * restart from killing the process (idle clients emit 'error' on the pool).
 */
export function pgPool(): pg.Pool {
  if (pool) return pool
  pool = new pg.Pool({ connectionString: config().databaseUrl, max: 6, idleTimeoutMillis: 10_000 })
  pool.on('error', (err) => logger.warn({ err: err.message }, 'pg pool: idle client error'))
  return pool
}

/** True when the database answers a trivial query within the timeout. */
export async function databaseUp(timeoutMs = 2000): Promise<boolean> {
  const client = new pg.Client({ connectionString: config().databaseUrl, connectionTimeoutMillis: timeoutMs })
  client.on('error', () => undefined)
  try {
    await client.connect()
    await client.query('SELECT 1')
    return true
  } catch {
    return false
  } finally {
    await client.end().catch(() => undefined)
  }
}

const MIGRATIONS_DIR = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations')

/** Umzug over server/migrations; files are imported from app code so this works under tsx and vitest. */
export function migrator(): Umzug<QueryInterface> {
  const s = sequelize()
  return new Umzug({
    migrations: () =>
      fs
        .readdirSync(MIGRATIONS_DIR)
        .filter((f) => /^\d{14}-.+\.ts$/.test(f))
        .sort()
        .map((f) => {
          const file = path.join(MIGRATIONS_DIR, f)
          const load = () => import(pathToFileURL(file).href)
          return {
            name: f.replace(/\.ts$/, ''),
            up: async ({ context }: { context: QueryInterface }) => (await load()).up(context, Sequelize),
            down: async ({ context }: { context: QueryInterface }) => (await load()).down(context, Sequelize),
          }
        }),
    context: s.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize: s }),
    logger: undefined,
  })
}

/** Closes every pool this module opened. */
export async function closeDb(): Promise<void> {
  await seq?.close().catch(() => undefined)
  await pool?.end().catch(() => undefined)
  seq = null
  pool = null
}
