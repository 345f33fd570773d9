import { describe, expect, it } from 'vitest'
import { DEFAULT_FIT_SELECTION_RULE, selectFitSamples } from '../../../../shared/propagation/fitSelection.js'

describe('selectFitSamples', () => {
  const distanceM = Float64Array.of(5, 100, 200, NaN, 400, 500, 600)
  const rx = Float64Array.of(-40, -130, -80, -85, -90, -95, -99)
  const inDropout = Uint8Array.of(0, 0, 0, 0, 1, 0, 0)
  const clearanceFraction = Float64Array.of(1, 1, 1, 1, 1, 0.3, 1)
  const rule = { ...DEFAULT_FIT_SELECTION_RULE, floorDbm: -130 }

  it('excludes each sample for its first reason and keeps the rest', () => {
    const sel = selectFitSamples(distanceM, rx, rule, { inDropout, clearanceFraction })
    expect([...sel.include]).toEqual([0, 0, 1, 0, 0, 0, 1])
    expect(sel.excluded).toEqual({ missing: 1, tooClose: 1, atFloor: 1, inDropout: 1, obstructed: 1 })
    expect(sel.includedCount).toBe(2)
  })
  it('reports the rule it applied', () =>
    expect(selectFitSamples(distanceM, rx, rule).rule).toEqual(rule))
  it('lets the caller keep obstructed and dropout samples', () => {
    const loose = { ...rule, excludeObstructed: false, excludeInDropout: false }
    expect(selectFitSamples(distanceM, rx, loose, { inDropout, clearanceFraction }).includedCount).toBe(4)
  })
  it('rejects arrays of different lengths', () =>
    expect(() => selectFitSamples(distanceM, new Float64Array(2))).toThrow(/rxPowerDbm/))
  it('rejects a negative minimum distance', () =>
    expect(() => selectFitSamples(distanceM, rx, { ...rule, minDistanceM: -1 })).toThrow(/minDistanceM/))
})
