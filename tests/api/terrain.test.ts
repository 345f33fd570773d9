import fs from 'node:fs'
import { beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app.js'
import { sequelize } from '../../server/db.js'
import { terrainProfile, terrainSampler } from '../../server/services/terrain.js'
import { SMALL_TIF, hgtElevationM, makeHgtTile, smallTifElevationM } from '../../server/scripts/fixtures/make-terrain.js'
import { resetDb, signedIn, signedInElsewhere, type SignedIn } from './helpers.js'

const app = createApp()
const SMALL_TIF_BYTES = fs.readFileSync('fixtures/terrain/small.tif')
let hgt: Buffer
beforeAll(() => {
  sequelize()
  hgt = makeHgtTile(1201)
})
beforeEach(resetDb)

async function newCourse(s: SignedIn): Promise<number> {
  const res = await s.agent.post('/api/courses').set('X-CSRF-Token', s.csrf).send({ name: 'field', stationLat: 52.87, stationLon: -0.06 })
  return res.body.id
}

function upload(s: SignedIn, courseId: number, bytes: Buffer, name: string) {
  return s.agent.post(`/api/courses/${courseId}/terrain`).set('X-CSRF-Token', s.csrf).attach('file', bytes, name)
}

describe('POST /api/courses/:courseId/terrain', () => {
  it('reads a GeoTIFF and samples it bilinearly at pixel centres and between them', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const res = await upload(s, id, SMALL_TIF_BYTES, 'small.tif')
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ hasTerrain: true, terrain: { format: 'geotiff', width: 41, height: 31 } })
    const sample = (await terrainSampler(id))!
    const { west, north, stepDeg } = SMALL_TIF
    // centre of pixel (col 10, row 5): half a pixel in from the tie point (pixel-is-area)
    const lat = (row: number) => north - (row + 0.5) * stepDeg
    const lon = (col: number) => west + (col + 0.5) * stepDeg
    expect(sample(lat(5), lon(10))).toBeCloseTo(smallTifElevationM(10, 5), 3)
    // halfway between columns 10 and 11 → mean of the two (generator is linear there)
    expect(sample(lat(5), lon(10.5))).toBeCloseTo((smallTifElevationM(10, 5) + smallTifElevationM(11, 5)) / 2, 3)
    expect(sample(lat(5), lon(29.5))).toBeCloseTo((smallTifElevationM(29, 5) + smallTifElevationM(30, 5)) / 2, 3)
    expect(sample(53.5, 0)).toBeNaN()
  })

  it('reads an SRTM .hgt tile named after its SW corner; void samples become NaN', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const res = await upload(s, id, hgt, 'N51W002.hgt')
    expect(res.status).toBe(201)
    expect(res.body.terrain).toMatchObject({ format: 'hgt', width: 1201, height: 1201, bbox: [-2, 51, -1, 52] })
    const sample = (await terrainSampler(id))!
    // 3-arc-second tile: 1200 intervals per degree; row 600 = 51.5°N, column 300 = 1.75°W
    expect(sample(51.5, -1.75)).toBeCloseTo(hgtElevationM(300, 600), 3)
    expect(sample(52, -2)).toBeNaN()
    const profile = (await terrainProfile(id, { latDeg: 51.5, lonDeg: -1.75 }, { latDeg: 51.5, lonDeg: -1.5 }, 3))!
    expect(profile.elevationM[2]).toBeCloseTo(hgtElevationM(600, 600), 3)
    // 0.25° of longitude at 51.5°N ≈ 17.3 km (cos 51.5° × 111.3 km × 0.25)
    expect(profile.distanceM[2]! / 1000).toBeCloseTo(17.35, 0)
  })

  it('does not serve a previous terrain’s cached samples when terrain ids restart (regression)', async () => {
    const first = await signedIn(app)
    const id1 = await newCourse(first)
    await upload(first, id1, SMALL_TIF_BYTES, 'small.tif')
    expect((await terrainSampler(id1))!(SMALL_TIF.north - 0.0005, SMALL_TIF.west + 0.0005)).toBeCloseTo(10, 3)
    await resetDb()
    const second = await signedIn(app)
    const id2 = await newCourse(second)
    await upload(second, id2, hgt, 'N51W002.hgt')
    expect((await terrainSampler(id2))!(51.5, -1.75)).toBeCloseTo(hgtElevationM(300, 600), 3)
  })

  it('replaces an earlier terrain, and DELETE removes it', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    await upload(s, id, SMALL_TIF_BYTES, 'small.tif')
    const second = await upload(s, id, hgt, 'N51W002.hgt')
    expect(second.body.terrain.format).toBe('hgt')
    const del = await s.agent.delete(`/api/courses/${id}/terrain`).set('X-CSRF-Token', s.csrf)
    expect(del.body).toMatchObject({ hasTerrain: false, terrain: null })
    expect(await terrainSampler(id)).toBeNull()
  })

  it('answers 415 for a file that is neither TIFF nor an SRTM tile, whatever its name', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const res = await upload(s, id, Buffer.from('\x89PNG\r\n\x1a\n not terrain'), 'N51W002.hgt')
    expect([res.status, res.body.error.code]).toEqual([415, 'UNSUPPORTED_MEDIA_TYPE'])
    expect((await s.agent.get(`/api/courses/${id}`)).body.hasTerrain).toBe(false)
  })

  it('answers 400 for an .hgt-sized file without a tile name', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const res = await upload(s, id, hgt, 'elevation.bin')
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })

  it('answers 422 for a damaged TIFF', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const res = await upload(s, id, SMALL_TIF_BYTES.subarray(0, 200), 'small.tif')
    expect([res.status, res.body.error.code]).toEqual([422, 'UNPROCESSABLE'])
  })

  it('answers 413 over the 64 MB limit', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const res = await upload(s, id, Buffer.alloc(64 * 1024 * 1024 + 1), 'big.tif')
    expect([res.status, res.body.error.code]).toEqual([413, 'PAYLOAD_TOO_LARGE'])
  })

  it('answers 404 for another team’s course and 403 for a viewer, before reading the file', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const other = await signedInElsewhere(app)
    const viewer = await signedIn(app, { role: 'viewer' })
    const a = await upload(other, id, SMALL_TIF_BYTES, 'small.tif')
    const b = await upload(viewer, id, SMALL_TIF_BYTES, 'small.tif')
    expect([a.status, a.body.error.code, b.status, b.body.error.code]).toEqual([404, 'NOT_FOUND', 403, 'FORBIDDEN'])
  })

  it('answers 400 without a file', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const res = await s.agent.post(`/api/courses/${id}/terrain`).set('X-CSRF-Token', s.csrf).field('note', 'x')
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })
})

describe('GET /api/courses/:courseId/terrain/profile', () => {
  const { west, north, stepDeg } = SMALL_TIF
  // along the centres of pixel row 5, from column 0 to column 40: one sample per pixel
  const row5 = north - 5.5 * stepDeg
  const q = (n: number | string, extra = '') =>
    `fromLat=${row5}&fromLon=${west + 0.5 * stepDeg}&toLat=${row5}&toLon=${west + 40.5 * stepDeg}&n=${n}${extra}`

  it('samples the uploaded terrain between two points, the ridge included; null outside the data', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    await upload(s, id, SMALL_TIF_BYTES, 'small.tif')
    const res = await s.agent.get(`/api/courses/${id}/terrain/profile?${q(41)}`)
    expect(res.status).toBe(200)
    expect(res.body.elevationM).toHaveLength(41)
    for (const col of [0, 10, 29, 30, 31, 40]) expect(res.body.elevationM[col]).toBeCloseTo(smallTifElevationM(col, 5), 3)
    // 40 pixels of 0.001° longitude at 52.884°N ≈ 2.69 km
    expect(res.body.distanceM[0]).toBe(0)
    expect(res.body.distanceM[40] / 1000).toBeCloseTo(2.69, 2)
    const outside = await s.agent.get(`/api/courses/${id}/terrain/profile?fromLat=52.87&fromLon=-0.06&toLat=53.5&toLon=0&n=3`)
    expect(outside.status).toBe(200)
    expect(outside.body.elevationM[2]).toBeNull()
    expect(outside.body.elevationM[0]).toBeTypeOf('number')
  })

  it('answers 404 without terrain and for another team’s course, 400 for a bad query', async () => {
    const s = await signedIn(app)
    const id = await newCourse(s)
    const none = await s.agent.get(`/api/courses/${id}/terrain/profile?${q(8)}`)
    expect([none.status, none.body.error.code, none.body.error.message]).toEqual([404, 'NOT_FOUND', 'This course has no terrain'])
    await upload(s, id, SMALL_TIF_BYTES, 'small.tif')
    const other = await signedInElsewhere(app)
    const theirs = await other.agent.get(`/api/courses/${id}/terrain/profile?${q(8)}`)
    expect([theirs.status, theirs.body.error.code]).toEqual([404, 'NOT_FOUND'])
    expect(JSON.stringify(theirs.body)).not.toContain('elevation')
    const tooMany = await s.agent.get(`/api/courses/${id}/terrain/profile?${q(513)}`)
    expect([tooMany.status, tooMany.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    const noTo = await s.agent.get(`/api/courses/${id}/terrain/profile?fromLat=52.87&fromLon=-0.06&n=8`)
    expect(noTo.status).toBe(400)
    expect(JSON.stringify(noTo.body.error.details)).toContain('toLat')
    const badLat = await s.agent.get(`/api/courses/${id}/terrain/profile?${q(8, '&fromLat=91')}`)
    expect(badLat.status).toBe(400)
  })
})
