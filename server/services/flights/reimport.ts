import type { AuthContext } from '../../types/express.js'
import type { ColumnMapping } from '../../../shared/import/mapping.js'
import { conflict, badRequest } from '../../errors.js'
import { Course } from '../../models/Course.js'
import { FlightImport } from '../../models/FlightImport.js'
import { editableFlight, rawFileExists } from './flights.js'
import { precheckUpload } from './precheck.js'
import { enqueueImport } from './queue.js'
import { sniffUpload } from './sniff.js'

/**
 * Re-imports a flight from its kept original with another mapping; the old samples stay until the new ones commit.
 * @param auth the caller
 * @param id flight id
 * @param mapping the new mapping
 * @returns the flight id and 'queued'
 */
export async function reimportFlight(auth: AuthContext, id: number, mapping: ColumnMapping): Promise<{ id: number; status: 'queued' }> {
  const f = await editableFlight(auth, id)
  if (f.sourceFormat !== 'delimited') throw badRequest('Only delimited logs have a column mapping to change')
  if (!(await rawFileExists(f.rawFile))) throw conflict('The original file of this flight is not available')
  const busy = await FlightImport.count({ where: { flightId: id, status: ['queued', 'importing'] } })
  if (busy) throw conflict('This flight is already being imported')
  const course = await Course.findByPk(f.courseId)
  const sniff = await sniffUpload(f.rawFile!)
  await precheckUpload(f.rawFile!, sniff, mapping, course!)
  const imp = await FlightImport.create({
    flightId: id,
    teamId: auth.teamId,
    createdBy: auth.userId,
    kind: 'reimport',
    params: { courseId: f.courseId, setupId: f.setupId, name: f.name, flownOn: f.flownOn, notes: f.notes, mapping, compressed: true },
    tempFile: f.rawFile,
    sourceFormat: 'delimited',
    progress: { bytesDone: 0, bytesTotal: sniff.sizeBytes, rowsDone: 0 },
  })
  await enqueueImport(imp.id)
  return { id, status: 'queued' }
}
