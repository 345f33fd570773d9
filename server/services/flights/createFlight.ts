import { z } from 'zod'
import type { AuthContext } from '../../types/express.js'
import { columnMappingSchema, type ColumnMapping } from '../../../shared/import/mapping.js'
import { signalLogMappingSchema } from '../../../shared/import/signalLog.js'
import { detectLayout } from '../../../shared/import/detect.js'
import { headerSignature } from '../../../shared/import/headerSignature.js'
import { splitQuoted } from '../../../shared/import/recordSplitter.js'
import { pgPool } from '../../db.js'
import { HttpError, badRequest } from '../../errors.js'
import { parseWith } from '../../middleware/validate.js'
import { Course } from '../../models/Course.js'
import { FlightImport } from '../../models/FlightImport.js'
import { LinkSetup } from '../../models/LinkSetup.js'
import { findMappingBySignature } from '../columnMappings.js'
import { precheckUpload, type SignalUpload } from './precheck.js'
import { unsupportedType } from './importErrors.js'
import type { SignalLogMapping } from '../../../shared/import/signalLog.js'
import { sniffUpload } from './sniff.js'
import { enqueueImport } from './queue.js'
import { removeFiles } from './storage.js'

const jsonMapping = z
  .string()
  .max(60_000)
  .transform((s, ctx) => {
    try {
      return JSON.parse(s) as unknown
    } catch {
      ctx.addIssue({ code: 'custom', message: 'mapping must be JSON' })
      return z.NEVER
    }
  })
  .pipe(columnMappingSchema)

/** Multipart text fields of POST /api/flights. */
export const uploadFieldsSchema = z.object({
  courseId: z.coerce.number().int().positive(),
  setupId: z.coerce.number().int().positive(),
  name: z.string().trim().min(1).max(200),
  flownOn: z.iso.date(),
  notes: z.string().max(5000).optional().default(''),
  mapping: jsonMapping.optional(),
  signalMapping: z
    .string()
    .max(60_000)
    .transform((s, ctx) => {
      try {
        return JSON.parse(s) as unknown
      } catch {
        ctx.addIssue({ code: 'custom', message: 'signalMapping must be JSON' })
        return z.NEVER
      }
    })
    .pipe(signalLogMappingSchema)
    .optional(),
})

/** An uploaded file as multer leaves it. */
export interface UploadedFile {
  path: string
  originalname: string
  size: number
}

/**
 * Loads a course and a setup of the caller's team, as the flight will point at them.
 * @throws 404 NOT_FOUND naming the field when either is missing or another team's (the same answer for both)
 */
export async function teamCourseAndSetup(teamId: number, courseId: number, setupId: number): Promise<{ course: Course; setup: LinkSetup }> {
  const [course, setup] = await Promise.all([
    Course.findOne({ where: { id: courseId, teamId } }),
    LinkSetup.findOne({ where: { id: setupId, teamId } }),
  ])
  const issues = [
    ...(course ? [] : [{ path: 'courseId', message: 'not found' }]),
    ...(setup ? [] : [{ path: 'setupId', message: 'not found' }]),
  ]
  if (issues.length) throw new HttpError(404, 'NOT_FOUND', 'Course or setup not found', issues)
  return { course: course!, setup: setup! }
}

function headerOf(head: string, delimiter: string): string[] {
  const first = head.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/, 1)[0] ?? ''
  return splitQuoted(first, delimiter).map((h) => h.trim())
}

/** The mapping sent with the upload, or else the team's saved one for this header. */
async function resolveMapping(teamId: number, sent: ColumnMapping | undefined, head: string): Promise<ColumnMapping> {
  if (sent) return sent
  const saved = await findMappingBySignature(teamId, headerSignature(headerOf(head, detectLayout(head).delimiter)))
  if (saved) return saved.mapping
  throw badRequest('Send a column mapping for this file', [{ path: 'mapping', message: 'required: no saved mapping matches this header' }])
}

/** Checks that a separate signal log comes with a GPX track and a mapping, and that it is text. */
async function signalLogFor(format: 'delimited' | 'gpx', extra: UploadedFile, mapping: SignalLogMapping | undefined): Promise<SignalUpload> {
  if (format !== 'gpx') throw badRequest('A separate signal log goes only with a GPX track', [{ path: 'signalFile', message: 'only with a GPX file' }])
  if (!mapping) throw badRequest('Send the signal log\'s column mapping', [{ path: 'signalMapping', message: 'required with signalFile' }])
  const sniff = await sniffUpload(extra.path)
  if (sniff.format !== 'delimited') throw unsupportedType('The signal log must be a delimited text log')
  return { file: extra.path, compressed: sniff.compressed, mapping }
}

/**
 * Accepts an upload: checks fields, course and setup, the file's content (and, for small files, every row), then
 * records the import and queues it. The flight itself appears only when the import commits.
 * @param auth the caller (a writer role)
 * @param file the uploaded log in tmp/ (removed on every refusal)
 * @param body multipart text fields
 * @returns the flight id reserved for this upload and its status
 */
export async function createFlightFromUpload(
  auth: AuthContext,
  file: UploadedFile | undefined,
  extra: UploadedFile | undefined,
  body: unknown,
): Promise<{ id: number; status: 'queued' }> {
  let handedOver = false
  try {
    if (!file) throw badRequest('Attach the log file', [{ path: 'file', message: 'required' }])
    const fields = parseWith(uploadFieldsSchema, body)
    const { course } = await teamCourseAndSetup(auth.teamId, fields.courseId, fields.setupId)
    const sniff = await sniffUpload(file.path)
    const mapping = sniff.format === 'gpx' ? null : await resolveMapping(auth.teamId, fields.mapping, sniff.head)
    const signal = extra ? await signalLogFor(sniff.format, extra, fields.signalMapping) : null
    await precheckUpload(file.path, sniff, mapping, course, signal)
    const { rows } = await pgPool().query<{ id: string }>(`SELECT nextval(pg_get_serial_sequence('flights', 'id')) AS id`)
    const flightId = Number(rows[0]!.id)
    const imp = await FlightImport.create({
      flightId,
      teamId: auth.teamId,
      createdBy: auth.userId,
      kind: 'create',
      params: {
        courseId: fields.courseId,
        setupId: fields.setupId,
        name: fields.name,
        flownOn: fields.flownOn,
        notes: fields.notes,
        mapping,
        compressed: sniff.compressed,
        signalFile: signal?.file ?? null,
        signalCompressed: signal?.compressed ?? false,
        signalMapping: signal?.mapping ?? null,
      },
      tempFile: file.path,
      sourceFormat: sniff.format,
      progress: { bytesDone: 0, bytesTotal: sniff.sizeBytes, rowsDone: 0 },
    })
    try {
      await enqueueImport(imp.id)
    } catch (e) {
      await imp.update({ status: 'failed', failure: { status: 503, code: 'UNAVAILABLE', message: 'The import queue is unavailable' }, tempFile: null })
      throw e
    }
    handedOver = true
    return { id: flightId, status: 'queued' }
  } finally {
    if (!handedOver) await removeFiles(file?.path, extra?.path)
  }
}
