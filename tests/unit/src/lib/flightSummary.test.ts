import { describe, expect, it } from 'vitest'
import type { FlightAnalysis } from '@shared/analysis/types'
import { rangeAtMarginM, summaryCards } from '@/lib/flightSummary'

const analysis = {
  fit: {
    exponent: 2.6,
    exponentLower: 2.4,
    exponentUpper: 2.8,
    confidenceLevel: 0.95,
    residualSigmaDb: 4.2,
    rSquared: 0.81,
    sampleCount: 1200,
  },
  fitError: null,
  model: { source: 'fit', interceptDbm: -40, exponent: 2, referenceDistanceM: 1 },
  distances: { maxDistanceM: 2500 },
  summary: {
    durationMs: 600_000,
    timeWithLinkMs: 540_000,
    maxDistanceWithLinkM: 2100,
    dropoutCount: 3,
    dropoutsByCause: { obstruction: 2, beam: 0, range: 0, reflection: 0, gap: 1, unexplained: 0 },
    eirpDbm: 22,
  },
} as unknown as FlightAnalysis

const fmt = (m: number) => `${Math.round(m)} m`

describe('rangeAtMarginM', () => {
  it('inverts the model at sensitivity plus margin', () => {
    // −40 − 20·log10(d) = −100 + 10  →  d = 10^(50/20) ≈ 316.2 m
    expect(rangeAtMarginM(analysis, -100, 10)).toBeCloseTo(316.23, 1)
  })
})

describe('summaryCards', () => {
  const cards = summaryCards(analysis, -100, 10, fmt)
  const byKey = Object.fromEntries(cards.map((c) => [c.key, c]))
  it('shows the exponent with its interval', () => {
    expect(byKey.exponent!.value).toBe('2.60')
    expect(byKey.exponent!.detail).toBe('95 % interval 2.40–2.80')
  })
  it('formats distances with the given formatter', () => {
    expect(byKey.furthest!.value).toBe('2100 m')
    expect(byKey.range!.value).toBe('316 m')
  })
  it('names dropouts by cause', () => expect(byKey.dropouts!.detail).toBe('2 path blocked, 1 log gap'))
  it('gives time with link and its share', () => {
    expect(byKey.time!.value).toBe('9:00')
    expect(byKey.time!.detail).toBe('90 % of 10:00')
  })
  it('gives every card a hover explanation', () => {
    for (const c of cards) expect(c.explain.length).toBeGreaterThan(20)
  })
  it('shows dashes and the reason when there is no fit', () => {
    const none = summaryCards({ ...analysis, fit: null, fitError: 'Fewer than 3 usable samples' }, -100, 10, fmt)
    expect(none[0]!.value).toBe('—')
    expect(none[0]!.detail).toBe('Fewer than 3 usable samples')
  })
})
