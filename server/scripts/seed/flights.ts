// Demo seed step: the generated flights go through the real import pipeline (CSV text → upload service → import
// job → analysis), then the "Power vs antenna" comparison is saved with a conclusion written from its numbers.
import fsp from 'node:fs/promises'
import path from 'node:path'
import { DEMO_COMPARISON_NAME, type ComparisonResultDto } from '../../../shared/types/comparison.js'
import type { AuthContext } from '../../middleware/auth.js'
import { pgPool } from '../../db.js'
import { createComparison, previewComparison } from '../../services/comparisons.js'
import { getCourse } from '../../services/courses.js'
import { getSetup } from '../../services/setups.js'
import { createFlightFromUpload } from '../../services/flights/createFlight.js'
import { runImport } from '../../services/flights/importRunner.js'
import { stopFlightJobs } from '../../services/flights/queue.js'
import { ensureStorageDirs, serverFileName, tmpDir } from '../../services/flights/storage.js'
import { demoFlightPlans, type DemoFlightPlan, type DemoSetups } from './generate-flights.js'


/** A log to import: CSV text plus what the upload form would send. */
export interface GeneratedLog {
  name: string
  notes: string
  flownOn: string
  courseId: number
  setupId: number
  csv: string
  mapping: DemoFlightPlan['mapping']
}

/**
 * Imports CSV text through the upload service and runs the import job at once (no waiting for a worker).
 * @param auth the pilot who "uploads" it
 * @param log the CSV text and its form fields
 * @returns the new flight's id, analysed
 * @throws Error when the import or analysis failed
 */
export async function importGeneratedLog(auth: AuthContext, log: GeneratedLog): Promise<number> {
  await ensureStorageDirs()
  const file = path.join(tmpDir(), serverFileName())
  await fsp.writeFile(file, log.csv)
  const body = {
    courseId: String(log.courseId),
    setupId: String(log.setupId),
    name: log.name,
    flownOn: log.flownOn,
    notes: log.notes,
    mapping: JSON.stringify(log.mapping),
  }
  const { id } = await createFlightFromUpload(auth, { path: file, originalname: `${log.name}.csv`, size: Buffer.byteLength(log.csv) }, undefined, body)
  const { rows } = await pgPool().query<{ id: number }>(`SELECT id FROM imports WHERE flight_id = $1 ORDER BY id DESC LIMIT 1`, [id])
  await runImport(rows[0]!.id)
  const { rows: st } = await pgPool().query<{ status: string; failure_reason: string | null }>(
    `SELECT status, failure_reason FROM flights WHERE id = $1`,
    [id],
  )
  if (st[0]?.status !== 'ready') {
    const { rows: imp } = await pgPool().query<{ failure: unknown }>(`SELECT failure FROM imports WHERE flight_id = $1`, [id])
    throw new Error(`Import of "${log.name}" did not finish: ${st[0]?.failure_reason ?? JSON.stringify(imp[0]?.failure)}`)
  }
  return id
}

function fmt(x: number | null, digits = 1): string {
  return x === null ? 'n/a' : x.toFixed(digits)
}

/**
 * Writes a journal-style conclusion from a comparison's measured numbers.
 * @param r the comparison result (baseline first, then the power and antenna flights)
 * @returns a paragraph of plain text
 */
export function composeConclusion(r: ComparisonResultDto): string {
  const base = r.flights.find((f) => f.isBaseline)!
  const parts = [
    `Baseline "${base.name}" (${fmt(base.setup.txPowerMw, 0)} mW, EIRP ${fmt(base.eirpDbm)} dBm, n = ${fmt(base.fit?.exponent ?? null, 2)}).`,
  ]
  for (const a of r.advantages) {
    const f = r.flights.find((x) => x.flightId === a.flightId)!
    const verdict =
      a.flag === 'shortfall'
        ? `below the ${fmt(a.predictedDb)} dB the datasheets predict: look for pointing, cable or antenna losses`
        : a.flag === 'excess'
          ? `above the ${fmt(a.predictedDb)} dB the datasheets predict`
          : `in line with the ${fmt(a.predictedDb)} dB the datasheets predict`
    parts.push(
      `"${f.name}": ${a.phrase ?? 'no shared distances'} (95 % CI ${fmt(a.lowerDb)} to ${fmt(a.upperDb)} dB over ${a.binCount} matched ${r.binWidthM} m bins), ` +
        `about ${fmt(a.rangeFactor, 2)}× the range at its fitted exponent, ${verdict}; EIRP ${fmt(f.eirpDbm)} dBm.`,
    )
  }
  parts.push(
    'Receive-antenna gain bought its range without raising EIRP; power bought it by raising EIRP, so check it against your regional limit before adopting it.',
  )
  return parts.join(' ')
}

/** Ids of the demo course and of the setups by role (what the course-and-setup seed step returns). */
export interface DemoCourseRefs {
  courseId: number
  setupIds: Record<keyof DemoSetups, number>
}

/**
 * Seeds the demo flights and the saved comparison for the demo team's course and setups. Closes the job-queue
 * connection the uploads opened, so call it from scripts and tests, not inside a process running job workers.
 * @param teamId the demo team
 * @param pilotUserId the user who "flew" them
 * @param refs the demo course and setups by role
 * @returns the flight ids by plan key and the comparison id
 */
export async function seedDemoFlightsAndComparison(
  teamId: number,
  pilotUserId: number,
  refs: DemoCourseRefs,
): Promise<{ flightIds: Record<DemoFlightPlan['key'], number>; comparisonId: number }> {
  const auth: AuthContext = { userId: pilotUserId, teamId, role: 'pilot' }
  const course = await getCourse(teamId, refs.courseId)
  const roles = Object.keys(refs.setupIds) as Array<keyof DemoSetups>
  const setups = Object.fromEntries(
    await Promise.all(roles.map(async (r) => [r, await getSetup(teamId, refs.setupIds[r])] as const)),
  ) as unknown as DemoSetups
  const flightIds = {} as Record<DemoFlightPlan['key'], number>
  try {
    for (const plan of demoFlightPlans(course, setups)) {
      flightIds[plan.key] = await importGeneratedLog(auth, { ...plan, courseId: course.id })
    }
  } finally {
    await stopFlightJobs()
  }
  const choice = {
    flightIds: [flightIds['low-omni'], flightIds['high-omni'], flightIds.directional],
    baselineId: flightIds['low-omni'],
    fadeMarginDb: 10,
  }
  const result = await previewComparison(teamId, choice)
  const saved = await createComparison(auth, { ...choice, name: DEMO_COMPARISON_NAME, conclusion: composeConclusion(result) })
  return { flightIds, comparisonId: saved.id }
}
