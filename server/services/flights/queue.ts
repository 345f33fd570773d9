import PgBoss from 'pg-boss'
import { config } from '../../config.js'
import { logger } from '../../logger.js'
import { ensureStorageDirs } from './storage.js'

export const IMPORT_QUEUE = 'flight-import'
export const ANALYSE_QUEUE = 'flight-analyse'
/** pg-boss's default schema (the constructor is given none). */
const BOSS_SCHEMA = 'pgboss'
/** Imports running at once in one instance; each holds one database connection for its transaction. */
const IMPORT_WORKERS = 2

let boss: PgBoss | null = null
let starting: Promise<PgBoss> | null = null
/** Data of a re-analysis job. */
export interface AnalyseJob {
  flightId: number
  /** The course changed: recompute every sample's distance from the new station first. */
  recomputeDistances: boolean
}

/** This instance's import workers, woken when it queues an import rather than waiting for their next poll. */
const importWorkers: string[] = []

let handlers: { runImport: (id: number) => Promise<void>; analyse: (job: AnalyseJob) => Promise<void> } | null = null

async function open(withWorkers: boolean): Promise<PgBoss> {
  const b = new PgBoss({ connectionString: config().databaseUrl, max: 4, supervise: withWorkers, schedule: false })
  // Without a listener an idle-connection error would crash the process (as with every pool).
  b.on('error', (err) => logger.warn({ err: err.message }, 'job queue error'))
  await b.start()
  await b.createQueue(IMPORT_QUEUE)
  await b.createQueue(ANALYSE_QUEUE)
  return b
}

/**
 * Starts the queue and this instance's workers (background service).
 * @param h the job handlers (passed in to keep the queue free of import logic)
 */
export async function startFlightJobs(h: NonNullable<typeof handlers>): Promise<void> {
  if (boss) return
  handlers = h
  await ensureStorageDirs()
  starting = open(true)
  boss = await starting
  const opts = { pollingIntervalSeconds: config().jobPollSeconds, batchSize: 1 }
  for (let i = 0; i < IMPORT_WORKERS; i++) {
    const id = await boss.work<{ importId: number }>(IMPORT_QUEUE, opts, async ([job]) => {
      if (job) await handlers!.runImport(job.data.importId)
    })
    importWorkers.push(id)
  }
  await boss.work<AnalyseJob>(ANALYSE_QUEUE, opts, async ([job]) => {
    if (job) await handlers!.analyse(job.data)
  })
}

/** Stops workers after their current job (bounded wait) and closes the queue's pool. */
export async function stopFlightJobs(): Promise<void> {
  const b = boss ?? (starting ? await starting.catch(() => null) : null)
  boss = null
  starting = null
  importWorkers.length = 0
  if (b) await b.stop({ graceful: true, wait: true, timeout: 20_000 })
}

async function sender(): Promise<PgBoss> {
  if (boss) return boss
  // An instance that serves HTTP without workers still enqueues.
  starting ??= open(false)
  boss = await starting
  return boss
}

/** Queues an import job. */
export async function enqueueImport(importId: number): Promise<void> {
  const b = await sender()
  const id = await b.send(IMPORT_QUEUE, { importId }, { retryLimit: 0, expireInMinutes: 60 })
  if (!id) throw new Error('The import queue refused the job')
  for (const w of importWorkers) b.notifyWorker(w)
}

/**
 * Which of these imports still have a job waiting, retrying or running (in any instance). A job of a killed
 * process stays 'active' until pg-boss expires it (expireInMinutes), after which it no longer counts.
 * @param importIds import record ids
 * @returns the ids whose job is live
 */
export async function liveImportJobs(importIds: readonly number[]): Promise<Set<number>> {
  if (!importIds.length) return new Set()
  const { rows } = await (await sender())
    .getDb()
    .executeSql(
      `SELECT DISTINCT (data->>'importId')::int AS id FROM ${BOSS_SCHEMA}.job
        WHERE name = $1 AND state IN ('created', 'retry', 'active') AND (data->>'importId')::int = ANY($2::int[])`,
      [IMPORT_QUEUE, importIds],
    )
  return new Set(rows.map((r: { id: number }) => Number(r.id)))
}

/** Queues a re-analysis job. */
export async function enqueueAnalysis(flightId: number, recomputeDistances: boolean): Promise<void> {
  const data: AnalyseJob = { flightId, recomputeDistances }
  const id = await (await sender()).send(ANALYSE_QUEUE, data, { retryLimit: 1, expireInMinutes: 30 })
  if (!id) throw new Error('The analysis queue refused the job')
}
