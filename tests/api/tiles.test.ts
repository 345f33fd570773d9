import { inflateSync } from 'node:zlib'
import { describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'
import { crc32 } from '../../server/services/png.js'
import { graticuleStepDeg } from '../../server/services/tiles.js'

const app = createApp()
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]

function chunks(png: Buffer): { type: string; data: Buffer; crcOk: boolean }[] {
  const out = []
  let p = 8
  while (p < png.length) {
    const len = png.readUInt32BE(p)
    const type = png.subarray(p + 4, p + 8).toString('latin1')
    const data = png.subarray(p + 8, p + 8 + len)
    const crcOk = png.readUInt32BE(p + 8 + len) === crc32(png.subarray(p + 4, p + 8 + len))
    out.push({ type, data, crcOk })
    p += 12 + len
  }
  return out
}

describe('GET /tiles/:z/:x/:y.png', () => {
  it('answers a valid 256×256 RGB PNG without signing in', async () => {
    const res = await request(app).get('/tiles/14/8190/5340.png').buffer(true)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('image/png')
    const png = res.body as Buffer
    expect([...png.subarray(0, 8)]).toEqual(PNG_SIGNATURE)
    const cs = chunks(png)
    expect(cs.map((c) => c.type)).toEqual(['IHDR', 'IDAT', 'IEND'])
    expect(cs.every((c) => c.crcOk)).toBe(true)
    const ihdr = cs[0]!.data
    expect([ihdr.readUInt32BE(0), ihdr.readUInt32BE(4), ihdr[8], ihdr[9]]).toEqual([256, 256, 8, 2])
    expect(inflateSync(cs[1]!.data).length).toBe(256 * (256 * 3 + 1))
  })

  it('draws graticule lines: a zoom-0 tile has pixels darker than the background', async () => {
    const res = await request(app).get('/tiles/0/0/0.png').buffer(true)
    const raw = inflateSync(chunks(res.body as Buffer)[1]!.data)
    const values = new Set<number>()
    for (let i = 0; i < raw.length; i += 97) values.add(raw[i]!)
    expect(values.size).toBeGreaterThan(1)
  })

  it('answers 404 NOT_FOUND outside the tile scheme', async () => {
    const a = await request(app).get('/tiles/2/4/0.png')
    const b = await request(app).get('/tiles/23/0/0.png')
    const c = await request(app).get('/tiles/1/0/0.jpg')
    expect([a.status, b.status, c.status]).toEqual([404, 404, 404])
    expect(a.body.error.code).toBe('NOT_FOUND')
  })
})

describe('graticuleStepDeg', () => {
  it('gives coarse steps at world zoom and fine steps close in', () => {
    expect(graticuleStepDeg(0)).toBe(30)
    // zoom 14 tiles span 0.022° of longitude: a third of that rounds up to 0.01°
    expect(graticuleStepDeg(14)).toBe(0.01)
    expect(graticuleStepDeg(18)).toBeLessThan(graticuleStepDeg(14))
  })
})
