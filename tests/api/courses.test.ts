import { beforeAll, beforeEach, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'
import { sequelize } from '../../server/db.js'
import type { CourseInput } from '../../shared/schemas/course.js'
import { resetDb, signedIn, signedInToTeam } from './helpers.js'

const app = createApp()
// models are initialised with the Sequelize instance; the helpers create teams through them
beforeAll(() => void sequelize())
beforeEach(resetDb)

function course(over: Partial<CourseInput> = {}): CourseInput {
  return {
    name: 'Heron Moor strip',
    notes: 'grass strip, tree line to the north',
    stationLat: 52.8712,
    stationLon: -0.0563,
    antennaHeightM: 2,
    groundElevM: 4,
    route: { type: 'LineString', coordinates: [[-0.0563, 52.8712], [-0.03, 52.875]] },
    obstacles: [
      { id: 'o1', label: 'tree line', kind: 'line', heightM: 14, coordinates: [[-0.05, 52.873], [-0.045, 52.874]] },
      { id: 'o2', label: 'mast', kind: 'point', heightM: 20, coordinates: [-0.04, 52.872] },
    ],
    ...over,
  }
}

describe('POST /api/courses', () => {
  it('creates a course with its obstacles and route and answers 201', async () => {
    const { agent, csrf, user } = await signedIn(app, { role: 'pilot' })
    const res = await agent.post('/api/courses').set('X-CSRF-Token', csrf).send(course())
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ name: 'Heron Moor strip', createdBy: user.id, hasTerrain: false, terrain: null })
    expect(res.body.obstacles).toHaveLength(2)
    expect(res.body.obstacles[1]).toEqual({ id: 'o2', label: 'mast', kind: 'point', heightM: 20, coordinates: [-0.04, 52.872] })
    expect(res.body.route.coordinates).toHaveLength(2)
  })

  it('answers 400 VALIDATION_FAILED naming the field for a latitude out of range', async () => {
    const { agent, csrf } = await signedIn(app)
    const res = await agent.post('/api/courses').set('X-CSRF-Token', csrf).send(course({ stationLat: 91 }))
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain('stationLat')
  })

  it('answers 400 for a polygon obstacle with two points and stores nothing', async () => {
    const { agent, csrf } = await signedIn(app)
    const bad = course({
      obstacles: [{ id: 'p', label: 'hangar', kind: 'polygon', heightM: 8, coordinates: [[0, 52], [0.001, 52]] }],
    })
    const res = await agent.post('/api/courses').set('X-CSRF-Token', csrf).send(bad)
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    expect(res.body.error.details[0].path).toBe('obstacles.0.coordinates')
    expect((await agent.get('/api/courses')).body.total).toBe(0)
  })

  it('answers 400 for a negative obstacle height', async () => {
    const { agent, csrf } = await signedIn(app)
    const bad = course({ obstacles: [{ id: 'x', label: 'pit', kind: 'point', heightM: -3, coordinates: [0, 52] }] })
    const res = await agent.post('/api/courses').set('X-CSRF-Token', csrf).send(bad)
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })

  it('answers 403 FORBIDDEN for a viewer', async () => {
    const { agent, csrf } = await signedIn(app, { role: 'viewer' })
    const res = await agent.post('/api/courses').set('X-CSRF-Token', csrf).send(course())
    expect([res.status, res.body.error.code]).toEqual([403, 'FORBIDDEN'])
  })

  it('answers 403 CSRF_FAILED without the CSRF header', async () => {
    const { agent } = await signedIn(app)
    const res = await agent.post('/api/courses').send(course())
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('CSRF_FAILED')
  })
})

describe('GET /api/courses', () => {
  it('answers 401 UNAUTHENTICATED when signed out', async () => {
    const res = await request(app).get('/api/courses')
    expect([res.status, res.body.error.code]).toEqual([401, 'UNAUTHENTICATED'])
  })

  it('searches by name or notes, sorts by a whitelisted key and pages', async () => {
    const { agent, csrf } = await signedIn(app)
    for (const name of ['Bravo field', 'Alpha strip', 'Charlie moor']) {
      await agent.post('/api/courses').set('X-CSRF-Token', csrf).send(course({ name, notes: name === 'Charlie moor' ? 'near the strip' : '' }))
    }
    const found = await agent.get('/api/courses').query({ q: 'STRIP', sort: 'name', order: 'asc' })
    expect(found.body.items.map((c: { name: string }) => c.name)).toEqual(['Alpha strip', 'Charlie moor'])
    expect(found.body.total).toBe(2)
    const page = await agent.get('/api/courses').query({ sort: 'name', order: 'desc', limit: 1, offset: 1 })
    expect(page.body).toMatchObject({ total: 3, items: [{ name: 'Bravo field' }] })
  })

  it('treats % and _ in the search text literally', async () => {
    const { agent, csrf } = await signedIn(app)
    await agent.post('/api/courses').set('X-CSRF-Token', csrf).send(course({ name: 'plain', notes: '' }))
    const res = await agent.get('/api/courses').query({ q: '%' })
    expect(res.body.total).toBe(0)
  })

  it('answers 400 for a sort key outside the whitelist', async () => {
    const { agent } = await signedIn(app)
    const res = await agent.get('/api/courses').query({ sort: 'name desc; DROP TABLE courses' })
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })

  it('lists only the caller’s team', async () => {
    const a = await signedIn(app)
    const b = await signedIn(app)
    await a.agent.post('/api/courses').set('X-CSRF-Token', a.csrf).send(course())
    expect((await b.agent.get('/api/courses')).body).toEqual({ items: [], total: 0 })
  })
})

describe('GET/PUT/DELETE /api/courses/:courseId', () => {
  it('answers 404 NOT_FOUND for another team’s course, on read, edit and delete', async () => {
    const a = await signedIn(app)
    const b = await signedIn(app)
    const id = (await a.agent.post('/api/courses').set('X-CSRF-Token', a.csrf).send(course())).body.id
    const get = await b.agent.get(`/api/courses/${id}`)
    const put = await b.agent.put(`/api/courses/${id}`).set('X-CSRF-Token', b.csrf).send(course({ name: 'taken' }))
    const del = await b.agent.delete(`/api/courses/${id}`).set('X-CSRF-Token', b.csrf)
    expect([get.status, put.status, del.status]).toEqual([404, 404, 404])
    expect(put.body.error.code).toBe('NOT_FOUND')
    expect((await a.agent.get(`/api/courses/${id}`)).body.name).toBe('Heron Moor strip')
  })

  it('answers 400 for a malformed id', async () => {
    const { agent } = await signedIn(app)
    const res = await agent.get('/api/courses/abc')
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })

  it('edits obstacles: an instructor of the team replaces the list', async () => {
    const pilot = await signedIn(app, { role: 'pilot' })
    const instr = await signedInToTeam(app, pilot.team.id, 'instructor')
    const created = (await pilot.agent.post('/api/courses').set('X-CSRF-Token', pilot.csrf).send(course())).body
    const obstacles = [
      ...created.obstacles.filter((o: { id: string }) => o.id !== 'o2'),
      { id: 'o3', label: 'hangar', kind: 'polygon', heightM: 7.5, coordinates: [[-0.052, 52.87], [-0.051, 52.87], [-0.051, 52.8705]] },
    ]
    const res = await instr.agent.put(`/api/courses/${created.id}`).set('X-CSRF-Token', instr.csrf).send(course({ obstacles }))
    expect(res.status).toBe(200)
    expect(res.body.obstacles.map((o: { label: string }) => o.label)).toEqual(['tree line', 'hangar'])
    expect((await pilot.agent.get(`/api/courses/${created.id}`)).body.obstacles[1].heightM).toBe(7.5)
  })

  it('answers 403 when a viewer edits', async () => {
    const pilot = await signedIn(app, { role: 'pilot' })
    const viewer = await signedInToTeam(app, pilot.team.id, 'viewer')
    const id = (await pilot.agent.post('/api/courses').set('X-CSRF-Token', pilot.csrf).send(course())).body.id
    const res = await viewer.agent.put(`/api/courses/${id}`).set('X-CSRF-Token', viewer.csrf).send(course())
    expect([res.status, res.body.error.code]).toEqual([403, 'FORBIDDEN'])
    expect((await viewer.agent.get(`/api/courses/${id}`)).status).toBe(200)
  })

  it('lets the creator delete (204), then answers 404', async () => {
    const { agent, csrf } = await signedIn(app, { role: 'pilot' })
    const id = (await agent.post('/api/courses').set('X-CSRF-Token', csrf).send(course())).body.id
    expect((await agent.delete(`/api/courses/${id}`).set('X-CSRF-Token', csrf)).status).toBe(204)
    expect((await agent.get(`/api/courses/${id}`)).status).toBe(404)
  })

  it('answers 403 when a pilot deletes another member’s course', async () => {
    const owner = await signedIn(app, { role: 'pilot' })
    const other = await signedInToTeam(app, owner.team.id, 'pilot')
    const id = (await owner.agent.post('/api/courses').set('X-CSRF-Token', owner.csrf).send(course())).body.id
    const res = await other.agent.delete(`/api/courses/${id}`).set('X-CSRF-Token', other.csrf)
    expect([res.status, res.body.error.code]).toEqual([403, 'FORBIDDEN'])
  })
})

describe('GET /api/config/map', () => {
  it('answers the local tile template when TILE_URL is unset', async () => {
    const res = await request(app).get('/api/config/map')
    expect(res.status).toBe(200)
    expect(res.body.tileUrl).toBe('/tiles/{z}/{x}/{y}.png')
    expect(typeof res.body.attribution).toBe('string')
  })
})
