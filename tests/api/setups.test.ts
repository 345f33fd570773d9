import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app.js'
import { sequelize } from '../../server/db.js'
import type { SetupInput } from '../../shared/schemas/setup.js'
import { resetDb, signedIn, signedInToTeam, type SignedIn } from './helpers.js'
import { ensureFlightsTable, insertFlight } from './flightRow.js'

const app = createApp()
let dropStandIn: () => Promise<void> = async () => undefined
beforeAll(async () => {
  sequelize()
  dropStandIn = await ensureFlightsTable()
})
afterAll(() => dropStandIn())
beforeEach(resetDb)

function setup(over: Partial<SetupInput> = {}): SetupInput {
  return {
    name: '868 omni 25 mW',
    band: '868 MHz',
    freqMHz: 868,
    channel: null,
    txPowerDbm: 14,
    txAntenna: { type: 'dipole', gainDbi: 2.15 },
    rxAntennas: [
      { label: '', type: 'dipole', kind: 'omni', gainDbi: 2.15, beamwidthDeg: null, azimuthDeg: null, elevationDeg: null, polarisation: 'vertical' },
    ],
    cableLossDb: 1,
    sensitivityDbm: -112,
    floorDbm: -130,
    notes: '',
    ...over,
  }
}

async function createSetup(s: SignedIn, over: Partial<SetupInput> = {}) {
  const res = await s.agent.post('/api/setups').set('X-CSRF-Token', s.csrf).send(setup(over))
  expect(res.status).toBe(201)
  return res.body
}

async function flyWith(s: SignedIn, setupId: number): Promise<void> {
  const course = await s.agent
    .post('/api/courses')
    .set('X-CSRF-Token', s.csrf)
    .send({ name: 'c', stationLat: 52, stationLon: 0 })
  await insertFlight(s.team.id, course.body.id, setupId, s.user.id)
}

describe('POST /api/setups', () => {
  it('stores dBm and answers mW, EIRP and version 1 of a new lineage', async () => {
    const s = await signedIn(app, { role: 'pilot' })
    const body = await createSetup(s, { txPowerDbm: 10 * Math.log10(250) })
    expect(body.txPowerMw).toBeCloseTo(250, 6)
    // EIRP = 23.98 dBm + 2.15 dBi (power + Tx gain; see shared/setup/derive.ts)
    expect(body.eirpDbm).toBeCloseTo(26.13, 2)
    expect(body).toMatchObject({ version: 1, isCurrent: true, lineageId: body.id, inUse: false })
  })

  it('estimates a blank beamwidth from the gain and marks it estimated; a typed one is kept', async () => {
    const s = await signedIn(app)
    const body = await createSetup(s, {
      rxAntennas: [
        { label: 'omni', type: 'dipole', kind: 'omni', gainDbi: 2.15, beamwidthDeg: null, azimuthDeg: null, elevationDeg: null, polarisation: 'vertical' },
        { label: 'patch', type: 'patch', kind: 'directional', gainDbi: 8, beamwidthDeg: 65, azimuthDeg: 90, elevationDeg: 5, polarisation: 'rhcp' },
      ],
    })
    // dipole elevation beam ≈ 78° from the omni approximation in shared/setup/beamwidth.ts
    expect(body.rxAntennas[0]).toMatchObject({ beamwidthEstimated: true, label: 'omni' })
    expect(body.rxAntennas[0].beamwidthDeg).toBeCloseTo(78, 0)
    expect(body.rxAntennas[1]).toMatchObject({ beamwidthDeg: 65, beamwidthEstimated: false, azimuthDeg: 90 })
  })

  it('answers 400 naming azimuthDeg for a directional antenna without pointing', async () => {
    const s = await signedIn(app)
    const res = await s.agent
      .post('/api/setups')
      .set('X-CSRF-Token', s.csrf)
      .send(setup({ rxAntennas: [{ label: '', type: 'patch', kind: 'directional', gainDbi: 8, beamwidthDeg: null, azimuthDeg: null, elevationDeg: 0, polarisation: 'vertical' }] }))
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain('rxAntennas.0.azimuthDeg')
  })

  it('answers 400 for three receive antennas', async () => {
    const s = await signedIn(app)
    const rx = setup().rxAntennas[0]!
    const res = await s.agent.post('/api/setups').set('X-CSRF-Token', s.csrf).send(setup({ rxAntennas: [rx, rx, rx] }))
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })

  it('answers 403 for a viewer', async () => {
    const s = await signedIn(app, { role: 'viewer' })
    const res = await s.agent.post('/api/setups').set('X-CSRF-Token', s.csrf).send(setup())
    expect([res.status, res.body.error.code]).toEqual([403, 'FORBIDDEN'])
  })
})

describe('PUT /api/setups/:setupId (versioning)', () => {
  it('edits an unused setup in place', async () => {
    const s = await signedIn(app)
    const v1 = await createSetup(s)
    const res = await s.agent.put(`/api/setups/${v1.id}`).set('X-CSRF-Token', s.csrf).send(setup({ txPowerDbm: 20 }))
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ id: v1.id, version: 1, txPowerDbm: 20 })
    expect((await s.agent.get(`/api/setups/${v1.id}/versions`)).body.total).toBe(1)
  })

  it('creates version 2 when a flight uses the setup, and the flight’s version keeps its numbers', async () => {
    const s = await signedIn(app)
    const v1 = await createSetup(s)
    await flyWith(s, v1.id)
    const res = await s.agent.put(`/api/setups/${v1.id}`).set('X-CSRF-Token', s.csrf).send(setup({ txPowerDbm: 24 }))
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ version: 2, lineageId: v1.id, isCurrent: true, txPowerDbm: 24 })
    expect(res.body.id).not.toBe(v1.id)
    const old = await s.agent.get(`/api/setups/${v1.id}`)
    expect(old.body).toMatchObject({ txPowerDbm: 14, isCurrent: false, inUse: true })
    const versions = await s.agent.get(`/api/setups/${res.body.id}/versions`)
    expect(versions.body.items.map((v: { version: number }) => v.version)).toEqual([2, 1])
    const list = await s.agent.get('/api/setups')
    expect(list.body.items.map((x: { id: number }) => x.id)).toEqual([res.body.id])
  })

  it('answers 409 CONFLICT when an old version is edited', async () => {
    const s = await signedIn(app)
    const v1 = await createSetup(s)
    await flyWith(s, v1.id)
    await s.agent.put(`/api/setups/${v1.id}`).set('X-CSRF-Token', s.csrf).send(setup({ txPowerDbm: 24 }))
    const res = await s.agent.put(`/api/setups/${v1.id}`).set('X-CSRF-Token', s.csrf).send(setup({ txPowerDbm: 27 }))
    expect([res.status, res.body.error.code]).toEqual([409, 'CONFLICT'])
  })

  it('answers 404 for another team’s setup and leaves it unchanged', async () => {
    const a = await signedIn(app)
    const b = await signedIn(app)
    const v1 = await createSetup(a)
    const put = await b.agent.put(`/api/setups/${v1.id}`).set('X-CSRF-Token', b.csrf).send(setup({ name: 'x' }))
    const ver = await b.agent.get(`/api/setups/${v1.id}/versions`)
    expect([put.status, put.body.error.code, ver.status]).toEqual([404, 'NOT_FOUND', 404])
    expect((await a.agent.get(`/api/setups/${v1.id}`)).body.name).toBe('868 omni 25 mW')
  })
})

describe('GET /api/setups', () => {
  it('searches by name or band and sorts by frequency', async () => {
    const s = await signedIn(app)
    await createSetup(s, { name: 'long range', band: '868 MHz', freqMHz: 868 })
    await createSetup(s, { name: 'control', band: '2.4 GHz', freqMHz: 2440 })
    const all = await s.agent.get('/api/setups').query({ sort: 'freqMHz', order: 'desc' })
    expect(all.body.items.map((x: { name: string }) => x.name)).toEqual(['control', 'long range'])
    const q = await s.agent.get('/api/setups').query({ q: '2.4' })
    expect(q.body).toMatchObject({ total: 1, items: [{ name: 'control' }] })
  })
})

describe('DELETE /api/setups/:setupId and courses in use', () => {
  it('deletes an unused setup (204)', async () => {
    const s = await signedIn(app)
    const v1 = await createSetup(s)
    expect((await s.agent.delete(`/api/setups/${v1.id}`).set('X-CSRF-Token', s.csrf)).status).toBe(204)
    expect((await s.agent.get(`/api/setups/${v1.id}`)).status).toBe(404)
  })

  it('answers 409 CONFLICT for a setup and a course that flights use', async () => {
    const s = await signedIn(app)
    const v1 = await createSetup(s)
    const course = await s.agent.post('/api/courses').set('X-CSRF-Token', s.csrf).send({ name: 'c', stationLat: 52, stationLon: 0 })
    await insertFlight(s.team.id, course.body.id, v1.id, s.user.id)
    const delSetup = await s.agent.delete(`/api/setups/${v1.id}`).set('X-CSRF-Token', s.csrf)
    const delCourse = await s.agent.delete(`/api/courses/${course.body.id}`).set('X-CSRF-Token', s.csrf)
    expect([delSetup.status, delSetup.body.error.code]).toEqual([409, 'CONFLICT'])
    expect([delCourse.status, delCourse.body.error.code]).toEqual([409, 'CONFLICT'])
    expect((await s.agent.get(`/api/courses/${course.body.id}`)).status).toBe(200)
  })

  it('answers 403 when an instructor deletes a pilot’s setup', async () => {
    const pilot = await signedIn(app, { role: 'pilot' })
    const instr = await signedInToTeam(app, pilot.team.id, 'instructor')
    const v1 = await createSetup(pilot)
    const res = await instr.agent.delete(`/api/setups/${v1.id}`).set('X-CSRF-Token', instr.csrf)
    expect([res.status, res.body.error.code]).toEqual([403, 'FORBIDDEN'])
  })
})
