import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Express } from 'express'
import { createApp } from '../../server/app.js'
import { generateFlight, type GeneratorSetup } from '../../shared/demo/generateFlight.js'
import type { PropagationTruth } from '../../shared/demo/signalModel.js'
import type { ComparisonResultDto } from '../../shared/types/comparison.js'
import type { LinkSetupDto } from '../../shared/types/setup.js'
import type { CourseDto } from '../../shared/types/course.js'
import { generatedFlightCsv, generatorCourse, generatorSetup, demoMapping } from '../../server/scripts/seed/generate-flights.js'
import { importGeneratedLog } from '../../server/scripts/seed/flights.js'
import { stopFlightJobs } from '../../server/services/flights/queue.js'
import { resetDb, signedIn, signedInElsewhere, signedInToTeam, type SignedIn } from './helpers.js'

// A straight 1.8 km course due east of the station; the directional antenna points along it.
const STATION = { lat: 52.4321, lon: -1.2345 }
const EAST_END_LON = STATION.lon + 1800 / (111_320 * Math.cos((STATION.lat * Math.PI) / 180))
const TRUTH: PropagationTruth = { exponent: 2.4, shadowSigmaDb: 4, shadowFieldSeed: 77, flightShadowSigmaDb: 1.5 }

const omni = { label: 'omni', type: 'dipole', kind: 'omni', gainDbi: 2, beamwidthDeg: null, azimuthDeg: null, elevationDeg: null, polarisation: 'vertical' }
const patch = { label: 'patch', type: 'patch', kind: 'directional', gainDbi: 10, beamwidthDeg: null, azimuthDeg: 90, elevationDeg: 3, polarisation: 'vertical' }
const setupBody = (name: string, txPowerDbm: number, rx: object[]) => ({
  name, band: '2.4 GHz', freqMHz: 2440, channel: null, txPowerDbm,
  txAntenna: { type: 'dipole', gainDbi: 2 }, rxAntennas: rx, cableLossDb: 1, sensitivityDbm: -105, floorDbm: -130, notes: '',
})

let app: Express
let pilot: SignedIn
let course: CourseDto
const flights: Record<string, number> = {}

async function fly(key: string, setup: LinkSetupDto, seed: number, truth: PropagationTruth = TRUTH) {
  const gen: GeneratorSetup = generatorSetup(setup)
  const f = generateFlight(generatorCourse(course), gen, { seed, profile: { speedMps: 15, cruiseAltM: 60 }, truth })
  flights[key] = await importGeneratedLog(
    { userId: pilot.user.id, teamId: pilot.team.id, role: 'pilot' },
    { name: key, notes: '', flownOn: '2026-11-01', courseId: course.id, setupId: setup.id, csv: generatedFlightCsv(f), mapping: demoMapping(f.rssiDbm.length === 2) },
  )
}

async function preview(ids: number[], baselineId: number): Promise<ComparisonResultDto> {
  const res = await pilot.agent.post('/api/comparisons/preview').set('X-CSRF-Token', pilot.csrf).send({ flightIds: ids, baselineId })
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return res.body
}

beforeAll(async () => {
  await resetDb()
  app = createApp()
  pilot = await signedIn(app, { role: 'pilot' })
  const c = await pilot.agent.post('/api/courses').set('X-CSRF-Token', pilot.csrf).send({
    name: 'Straight east', stationLat: STATION.lat, stationLon: STATION.lon, antennaHeightM: 2, groundElevM: 40,
    route: { type: 'LineString', coordinates: [[STATION.lon, STATION.lat], [EAST_END_LON, STATION.lat]] }, obstacles: [],
  })
  expect(c.status, JSON.stringify(c.body)).toBe(201)
  course = c.body
  const mk = async (body: object) => {
    const r = await pilot.agent.post('/api/setups').set('X-CSRF-Token', pilot.csrf).send(body)
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    return r.body as LinkSetupDto
  }
  const low = await mk(setupBody('25 mW omni', 13.98, [omni]))
  const high = await mk(setupBody('250 mW omni', 23.98, [omni]))
  const dir = await mk(setupBody('25 mW patch', 13.98, [patch]))
  await fly('low', low, 11)
  await fly('high', high, 12)
  await fly('patch', dir, 13)
  // the same datasheet numbers, but 4 dB lost somewhere the setup does not list
  await fly('patchShort', dir, 14, { ...TRUTH, hiddenLossDb: 4 })
}, 120_000)

afterAll(async () => {
  await stopFlightJobs()
})

describe('POST /api/comparisons/preview', () => {
  it('measures each advantage within ±1 dB of the generated truth (+10 dB power, +8 dB receive gain)', async () => {
    const r = await preview([flights.low!, flights.high!, flights.patch!], flights.low!)
    const adv = (id: number) => r.advantages.find((a) => a.flightId === id)!
    // truth: the generator applies exactly +10 dB of power and 10 − 2 = 8 dBi more receive gain on boresight
    expect(Math.abs(adv(flights.high!).measuredDb! - 10)).toBeLessThanOrEqual(1)
    expect(Math.abs(adv(flights.patch!).measuredDb! - 8)).toBeLessThanOrEqual(1)
    expect(adv(flights.high!).binCount).toBeGreaterThan(20)
    expect(adv(flights.high!).predictedDb).toBeCloseTo(10, 1)
    expect(adv(flights.high!).flag).toBeNull()
    expect(adv(flights.high!).phrase).toMatch(/^\+\d+\.\d dB: like \d+(\.\d)?× the power$/)
    expect(r.flights.map((f) => f.flightId)).toEqual([flights.low, flights.high, flights.patch])
    expect(r.flights[0]!.isBaseline).toBe(true)
    expect(r.flights[0]!.fit!.exponent).toBeGreaterThan(1.5)
    expect(r.flights[0]!.fit!.exponent).toBeLessThan(3.5)
    expect(r.flights[1]!.scatter.length).toBeGreaterThan(100)
  })

  it('flags a shortfall when the antenna delivers 4 dB less than its datasheet', async () => {
    const r = await preview([flights.low!, flights.patchShort!], flights.low!)
    const a = r.advantages[0]!
    expect(Math.abs(a.measuredDb! - 4)).toBeLessThanOrEqual(1)
    expect(a.predictedDb).toBeGreaterThan(7)
    expect(a.flag).toBe('shortfall')
  })

  it('recomputes against a new baseline: the advantages change sign', async () => {
    const r = await preview([flights.low!, flights.high!], flights.high!)
    expect(r.baselineId).toBe(flights.high)
    expect(Math.abs(r.advantages[0]!.measuredDb! + 10)).toBeLessThanOrEqual(1)
  })

  it('responds 400 VALIDATION_FAILED when the baseline is not among the flights', async () => {
    const res = await pilot.agent.post('/api/comparisons/preview').set('X-CSRF-Token', pilot.csrf)
      .send({ flightIds: [flights.low, flights.high], baselineId: flights.patch })
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })

  it('responds 404 NOT_FOUND for another team asking about these flights', async () => {
    const other = await signedInElsewhere(app)
    const res = await other.agent.post('/api/comparisons/preview').set('X-CSRF-Token', other.csrf)
      .send({ flightIds: [flights.low, flights.high], baselineId: flights.low })
    expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
  })
})

describe('/api/comparisons', () => {
  it('saves a comparison and reopens it with the same choices and conclusion', async () => {
    const body = { name: 'Power vs patch', conclusion: 'Patch wins.', flightIds: [flights.low, flights.patch], baselineId: flights.low, fadeMarginDb: 12 }
    const saved = await pilot.agent.post('/api/comparisons').set('X-CSRF-Token', pilot.csrf).send(body)
    expect(saved.status).toBe(201)
    const list = await pilot.agent.get('/api/comparisons')
    expect(list.body.total).toBe(1)
    const got = await pilot.agent.get(`/api/comparisons/${saved.body.id}`)
    expect(got.status).toBe(200)
    expect([got.body.flightIds, got.body.baselineId, got.body.fadeMarginDb, got.body.conclusion]).toEqual([body.flightIds, body.baselineId, 12, 'Patch wins.'])
    expect(got.body.result.fadeMarginDb).toBe(12)
    const put = await pilot.agent.put(`/api/comparisons/${saved.body.id}`).set('X-CSRF-Token', pilot.csrf)
      .send({ ...body, baselineId: flights.patch, conclusion: 'Checked again.' })
    expect([put.status, put.body.baselineId]).toEqual([200, flights.patch])
  })

  it('lets a viewer read but answers 403 FORBIDDEN when a viewer saves', async () => {
    const viewer = await signedInToTeam(app, pilot.team.id, 'viewer')
    expect((await viewer.agent.get('/api/comparisons')).status).toBe(200)
    const res = await viewer.agent.post('/api/comparisons').set('X-CSRF-Token', viewer.csrf)
      .send({ name: 'x', flightIds: [flights.low, flights.high], baselineId: flights.low })
    expect([res.status, res.body.error.code]).toEqual([403, 'FORBIDDEN'])
  })

  it('answers 404 NOT_FOUND for another team reading a saved comparison, and deletes it for its author', async () => {
    const list = await pilot.agent.get('/api/comparisons')
    const id = list.body.items[0].id
    const other = await signedInElsewhere(app)
    const res = await other.agent.get(`/api/comparisons/${id}`)
    expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
    const del = await pilot.agent.delete(`/api/comparisons/${id}`).set('X-CSRF-Token', pilot.csrf)
    expect(del.status).toBe(204)
    expect((await pilot.agent.get(`/api/comparisons/${id}`)).status).toBe(404)
  })
})
