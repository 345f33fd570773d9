import { describe, expect, it } from 'vitest'
import { groundDistanceM } from '@shared/geo/localOffset'
import { initialBearingDeg } from '@shared/geo/bearing'
import { beamSectorRing } from '@/lib/beamSector'

describe('beamSectorRing', () => {
  const ring = beamSectorRing(52.1, -1.3, 90, 30, 2000, 10)
  it('starts and ends at the station', () => {
    expect(ring[0]).toEqual([52.1, -1.3])
    expect(ring[ring.length - 1]).toEqual([52.1, -1.3])
  })
  it('puts every arc point at the requested radius (within 1 m)', () => {
    for (const [lat, lon] of ring.slice(1, -1)) expect(groundDistanceM(52.1, -1.3, lat, lon)).toBeCloseTo(2000, -0.3)
  })
  it('spans azimuth ± half the beamwidth', () => {
    const first = ring[1]!
    const last = ring[ring.length - 2]!
    expect(initialBearingDeg(52.1, -1.3, first[0], first[1])).toBeCloseTo(75, 1)
    expect(initialBearingDeg(52.1, -1.3, last[0], last[1])).toBeCloseTo(105, 1)
  })
  it('rejects a zero radius', () => expect(() => beamSectorRing(52, -1, 0, 30, 0)).toThrow(/radiusM/))
})
