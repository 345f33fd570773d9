import { analyseAndStore } from './analyse.js'
import { recomputeDistances } from './flights.js'
import { runImport } from './importRunner.js'
import { startFlightJobs, stopFlightJobs, type AnalyseJob } from './queue.js'
import { recoverInterruptedImports } from './recovery.js'
import { removeOrphanTempFiles } from './storage.js'
import { FlightImport } from '../../models/FlightImport.js'
import { logger } from '../../logger.js'

/** Uploads older than this with no unfinished import are leftovers of a crash. */
const ORPHAN_AGE_MS = 6 * 3600_000
/** How often to look for imports whose job pg-boss has expired (a process killed mid-import elsewhere). */
const RECOVER_EVERY_MS = 5 * 60_000

let recoverTimer: NodeJS.Timeout | null = null

async function recover(): Promise<void> {
  await recoverInterruptedImports().catch((e: Error) => logger.warn({ err: e.message }, 'interrupted-import check failed'))
}

async function sweepTempFiles(): Promise<void> {
  const open = await FlightImport.findAll({ where: { status: ['queued', 'importing', 'analysing'] }, attributes: ['tempFile', 'params'] })
  const inUse = new Set(open.flatMap((i) => [i.tempFile, i.params.signalFile].filter((f): f is string => Boolean(f))))
  const n = await removeOrphanTempFiles(inUse, ORPHAN_AGE_MS)
  if (n) logger.info({ removed: n }, 'removed orphaned upload files')
}

async function analyse(job: AnalyseJob): Promise<void> {
  if (job.recomputeDistances) await recomputeDistances(job.flightId)
  await analyseAndStore(job.flightId)
}

/** Background service: the flight import and analysis workers of this instance. */
export const flightJobsService = {
  name: 'flight jobs',
  start: async () => {
    await startFlightJobs({ runImport, analyse })
    // Settled before the temp sweep, so the files of imports failed here go at once.
    await recover()
    recoverTimer ??= setInterval(() => void recover(), RECOVER_EVERY_MS).unref()
    await sweepTempFiles().catch((e: Error) => logger.warn({ err: e.message }, 'temp sweep failed'))
  },
  stop: async () => {
    if (recoverTimer) clearInterval(recoverTimer)
    recoverTimer = null
    await stopFlightJobs()
  },
}
