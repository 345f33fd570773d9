import { describe, expect, it } from 'vitest'
import { bestSignal, formatElapsed, nearestIndex } from '@/lib/series'

describe('nearestIndex', () => {
  const t = [0, 100, 200, 400]
  it('finds the closest sample', () => {
    expect(nearestIndex(t, 140)).toBe(1)
    expect(nearestIndex(t, 160)).toBe(2)
    expect(nearestIndex(t, 350)).toBe(3)
  })
  it('clamps before the start and after the end', () => {
    expect(nearestIndex(t, -10)).toBe(0)
    expect(nearestIndex(t, 1e9)).toBe(3)
  })
  it('returns -1 for an empty series', () => expect(nearestIndex([], 5)).toBe(-1))
})

describe('bestSignal', () => {
  it('takes the stronger antenna', () => expect(bestSignal(-80, -72)).toBe(-72))
  it('uses the one present', () => expect(bestSignal(null, -72)).toBe(-72))
  it('returns null when neither is present', () => expect(bestSignal(null, Number.NaN)).toBeNull())
})

describe('formatElapsed', () => {
  it('writes minutes and seconds', () => expect(formatElapsed(125_400)).toBe('2:05'))
  it('writes hours when needed', () => expect(formatElapsed(3_725_000)).toBe('1:02:05'))
})

describe('distanceAxisUnit', async () => {
  const { distanceAxisUnit, heightAxisUnit } = await import('@/lib/axisUnits')
  it('uses km for long metric courses and m for short ones', () => {
    expect(distanceAxisUnit(5000, 'metric').unit).toBe('km')
    expect(distanceAxisUnit(800, 'metric')).toEqual({ unit: 'm', perMetre: 1 })
  })
  it('uses mi from half a mile and ft below', () => {
    expect(distanceAxisUnit(1609.344, 'imperial').perMetre).toBeCloseTo(1 / 1609.344, 12)
    expect(distanceAxisUnit(300, 'imperial').unit).toBe('ft')
  })
  it('gives heights in ft for imperial', () => expect(heightAxisUnit('imperial').unit).toBe('ft'))
})
