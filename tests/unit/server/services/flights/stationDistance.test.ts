import { describe, expect, it } from 'vitest'
import { groundDistanceM } from '../../../../../shared/geo/localOffset.js'
import { distanceFromStation } from '../../../../../server/services/flights/stationDistance.js'

describe('distanceFromStation', () => {
  it('gives exactly what shared groundDistanceM gives, including across the antimeridian', () => {
    let seed = 3
    const rnd = () => ((seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 2 ** 32)
    for (const [sLat, sLon] of [[52.0412, -1.3127], [-33.9, 151.2], [10, 179.99], [70.5, -179.9]] as const) {
      const d = distanceFromStation(sLat, sLon)
      for (let i = 0; i < 2000; i++) {
        const lat = Math.max(-90, Math.min(90, sLat + (rnd() - 0.5) * 0.5))
        let lon = sLon + (rnd() - 0.5) * 0.5
        if (lon > 180) lon -= 360
        if (lon < -180) lon += 360
        expect(d(lat, lon)).toBe(groundDistanceM(sLat, sLon, lat, lon))
      }
    }
  })
})
