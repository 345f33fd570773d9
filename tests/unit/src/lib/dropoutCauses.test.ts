import { describe, expect, it } from 'vitest'
import { causeStyle, evidenceText } from '@/lib/dropoutCauses'

describe('evidenceText', () => {
  const base = {
    minClearanceFraction: 0.32,
    limitingObstacle: 'tree line',
    maxPointingLossDb: 0.2,
    predictedMarginDb: 14.25,
    signalBeforeDbm: -81.6,
    suddenFade: true,
    nearestNullM: 420,
    nearNull: false,
  }
  it('lists clearance with the limiting obstacle, margin and the signal before', () =>
    expect(evidenceText(base, (m) => `${m} m`)).toBe(
      'Fresnel clearance 32 % (tree line) · model margin 14.3 dB · signal before -82 dBm, sudden fade',
    ))
  it('mentions pointing loss and a nearby null when they matter', () =>
    expect(evidenceText({ ...base, minClearanceFraction: null, predictedMarginDb: null, signalBeforeDbm: null, maxPointingLossDb: 6, nearNull: true }, (m) => `${m} m`)).toBe(
      '6.0 dB off the beam · near a reflection null at 420 m',
    ))
  it('says the line of sight is cut instead of a negative clearance', () =>
    expect(evidenceText({ ...base, minClearanceFraction: -3.2, predictedMarginDb: null, signalBeforeDbm: null }, (m) => `${m} m`)).toBe(
      'line of sight cut by tree line',
    ))
  it('falls back to "unexplained" styling for an unknown cause', () => expect(causeStyle('solar flare').letter).toBe('?'))
})
