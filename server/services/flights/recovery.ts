import fsp from 'node:fs/promises'
import { Op } from 'sequelize'
import { logger } from '../../logger.js'
import { Flight } from '../../models/Flight.js'
import { FlightImport } from '../../models/FlightImport.js'
import type { ImportFailure } from '../../../shared/types/flight.js'
import { keepOriginal } from './importRunner.js'
import { enqueueAnalysis, liveImportJobs } from './queue.js'
import { removeFiles } from './storage.js'

/** An unfinished import younger than this may be between its record and its job (upload in flight). */
const GRACE_MS = 60_000

function interrupted(kind: FlightImport['kind']): ImportFailure {
  const message = kind === 'create' ? 'The import was interrupted; upload the file again' : 'The re-import was interrupted; start it again'
  return { status: 503, code: 'UNAVAILABLE', message }
}

/** Claims the import by moving it from the status it was read in; false when a worker moved it meanwhile. */
async function claim(imp: FlightImport, values: Partial<Pick<FlightImport, 'status' | 'failure' | 'tempFile'>>): Promise<boolean> {
  const [n] = await FlightImport.update(values, { where: { id: imp.id, status: imp.status } })
  return n === 1
}

/** Finishes or fails one import whose job is gone. */
async function recoverImport(imp: FlightImport): Promise<void> {
  const flight = await Flight.findByPk(imp.flightId, { attributes: ['id', 'status'] })
  // The samples committed (the flight went to 'analysing' in the same transaction): only the analysis is missing.
  const committed = imp.status === 'analysing' || flight?.status === 'analysing'
  if (committed && flight) {
    if (!(await claim(imp, { status: 'ready', tempFile: null }))) return
    const tempLeft = imp.kind === 'create' && imp.tempFile && (await fsp.access(imp.tempFile).then(() => true, () => false))
    if (tempLeft) await keepOriginal(imp, imp.params.compressed === true)
    await removeFiles(imp.params.signalFile)
    await enqueueAnalysis(imp.flightId, false)
    return
  }
  // Nothing committed: the killed transaction rolled back, so no flight row or sample of a new upload exists.
  if (!(await claim(imp, { status: 'failed', failure: interrupted(imp.kind), tempFile: null }))) return
  // A re-import reads the kept original in place: it must stay.
  if (imp.kind === 'create') await removeFiles(imp.tempFile, imp.params.signalFile)
}

/**
 * Settles imports left unfinished by a killed or crashed process: each unfinished import whose pg-boss job is no
 * longer live is failed ("interrupted; upload again") and its temp files removed, or, if its samples had committed,
 * marked done with its analysis queued again.
 * @returns how many imports were settled
 */
export async function recoverInterruptedImports(): Promise<number> {
  const open = await FlightImport.findAll({
    where: { status: ['queued', 'importing', 'analysing'], updatedAt: { [Op.lt]: new Date(Date.now() - GRACE_MS) } },
  })
  const live = await liveImportJobs(open.map((i) => i.id))
  const dead = open.filter((i) => !live.has(i.id))
  for (const imp of dead) {
    await recoverImport(imp).catch((e: Error) => logger.warn({ err: e.message, importId: imp.id }, 'could not settle an interrupted import'))
  }
  if (dead.length) logger.info({ settled: dead.length }, 'settled interrupted imports')
  return dead.length
}
