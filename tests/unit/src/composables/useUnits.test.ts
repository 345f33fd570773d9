import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import type { MeDto } from '@shared/types/api'
import { useAuthStore } from '@/stores/auth'
import { formatSpeed, heightIn, heightToM, useUnits } from '@/composables/useUnits'

const ME: MeDto = {
  id: 1,
  email: 'a@example.test',
  name: 'A',
  units: 'imperial',
  currentTeamId: 1,
  teams: [{ id: 1, name: 'T', role: 'pilot' }],
}

beforeEach(() => setActivePinia(createPinia()))

describe('formatSpeed', () => {
  // 10 m/s = 36 km/h exactly; 36 / 1.609344 = 22.37 mph
  it('gives km/h in metric and mph in imperial', () => {
    expect(formatSpeed(10, 'metric')).toBe('36.0 km/h')
    expect(formatSpeed(10, 'imperial')).toBe('22.4 mph')
  })
  it('rejects a non-finite speed', () => expect(() => formatSpeed(NaN, 'metric')).toThrow(/speedMS/))
})

describe('heightIn / heightToM', () => {
  // 1 ft = 0.3048 m exactly
  it('converts 120 m to about 393.7 ft and back', () => {
    expect(heightIn(120, 'imperial')).toBeCloseTo(393.7, 1)
    expect(heightToM(393.7007874, 'imperial')).toBeCloseTo(120, 6)
    expect(heightIn(120, 'metric')).toBe(120)
  })
})

describe('useUnits', () => {
  it('formats in metric when nobody is signed in', () => {
    const u = useUnits()
    expect([u.system.value, u.distance(1250), u.height(120), u.speedUnit.value]).toEqual([
      'metric',
      '1.25 km',
      '120 m',
      'km/h',
    ])
  })

  it("follows the signed-in user's imperial preference and reacts to a change", () => {
    const auth = useAuthStore()
    auth.me = { ...ME }
    const u = useUnits()
    // 120 m / 0.3048 = 393.7 ft; 1250 m / 1609.344 = 0.78 mi
    expect([u.height(120), u.distance(1250), u.heightUnit.value]).toEqual(['394 ft', '0.78 mi', 'ft'])
    auth.me = { ...ME, units: 'metric' }
    expect(u.height(120)).toBe('120 m')
  })
})
