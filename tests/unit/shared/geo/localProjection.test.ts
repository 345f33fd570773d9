import { describe, expect, it } from 'vitest'
import { localOffsetM } from '../../../../shared/geo/localOffset.js'
import { createLocalProjection, projectToLocal } from '../../../../shared/geo/localProjection.js'

describe('projectToLocal', () => {
  it('agrees with the mid-latitude offsets to 1e-6 relative up to 50 km', () => {
    let seed = 99
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647
    for (let i = 0; i < 2000; i++) {
      const lat0 = -70 + 140 * rnd()
      const lon0 = -170 + 340 * rnd()
      const proj = createLocalProjection(lat0, lon0)
      const r = 50_000 * rnd()
      const az = 2 * Math.PI * rnd()
      const lat = lat0 + (r * Math.cos(az)) / 111_000
      const lon = lon0 + (r * Math.sin(az)) / (111_000 * Math.cos((lat0 * Math.PI) / 180))
      const a = projectToLocal(proj, lat, lon)
      const b = localOffsetM(lat0, lon0, lat, lon)
      const err = Math.hypot(a.eastM - b.eastM, a.northM - b.northM) / Math.max(1, Math.hypot(b.eastM, b.northM))
      expect(err).toBeLessThan(1e-6)
    }
  })
  it('maps the origin to 0, 0', () => {
    const p = createLocalProjection(52, 0.5)
    expect(projectToLocal(p, 52, 0.5)).toEqual({ eastM: 0, northM: 0 })
  })
  it('rejects an origin at the pole naming originLatDeg', () => expect(() => createLocalProjection(90, 0)).toThrow(/originLatDeg/))
})
