import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { planLink, type PlanInput } from '../../../../shared/planning/linkPlan.js'
import { POWER_LIMIT_PRESETS } from '../../../../shared/planning/powerLimits.js'

interface Check {
  id: string
  fn: string
  inputs: Record<string, number>
  expected: number
  tolerance: { abs?: number; rel?: number }
  source: string
}
const checks: Check[] = JSON.parse(
  readFileSync(new URL('../../../../fixtures/reference/check-values.json', import.meta.url), 'utf8'),
).checks
const byFn = (fn: string) => checks.filter((c) => c.fn === fn)
const within = (actual: number, c: Check) => {
  const err = Math.abs(actual - c.expected)
  const ok = (c.tolerance.abs !== undefined && err <= c.tolerance.abs) ||
    (c.tolerance.rel !== undefined && err <= c.tolerance.rel * Math.abs(c.expected))
  expect(ok, `${c.id} (${c.source}): got ${actual}, expected ${c.expected}`).toBe(true)
}

function freeSpaceInput(i: Record<string, number>, targetRangeM: number): PlanInput {
  return {
    radio: {
      freqMHz: i.f_mhz!,
      txPowerDbm: i.pt_dbm!,
      txGainDbi: i.gt_dbi!,
      rxGainDbi: i.gr_dbi!,
      rxKind: 'omni',
      rxBeamwidthDeg: null,
      cableLossDb: i.lcables_db ?? (i.ltx_db ?? 0) + (i.lrx_db ?? 0),
      sensitivityDbm: i.sens_dbm!,
    },
    measured: null,
    fadeMarginDb: i.fade_margin_db ?? 0,
    targetRangeM,
    limits: null,
  }
}

describe('planLink against fixtures/reference', () => {
  it('gives the free-space range at sensitivity + fade margin (link budget, exact ITU-R P.525)', () => {
    const cases = byFn('max_fs_range_km')
    expect(cases.length).toBeGreaterThan(0)
    for (const c of cases) within(planLink(freeSpaceInput(c.inputs, 1000)).rangeM / 1000, c)
  })

  it('gives the free-space margin at a target distance (Friis)', () => {
    const cases = byFn('link_margin_db')
    expect(cases.length).toBeGreaterThan(0)
    for (const c of cases) within(planLink(freeSpaceInput(c.inputs, c.inputs.d_km! * 1000)).marginAtTargetDb, c)
  })

  it('scales range by the reference range ratios for a trade of Δ dB at exponent n (log-distance model)', () => {
    const cases = byFn('range_ratio')
    for (const c of cases) {
      const measured = { interceptDbm: -40, exponent: c.inputs.n!, referenceDistanceM: 1, txPowerDbm: 20, txGainDbi: 2, rxGainDbi: 2, cableLossDb: 1 }
      const base = freeSpaceInput({ f_mhz: 2440, pt_dbm: 20, gt_dbi: 2, gr_dbi: 2, lcables_db: 1, sens_dbm: -100, fade_margin_db: 10 }, 1000)
      const plan = planLink({ ...base, measured, tradeDb: c.inputs.delta_db })
      within(plan.tradeRangeFactor, c)
      within(plan.withGain.rangeM / plan.rangeM, c)
    }
  })

  it('gives the power-equivalent of a receive-gain change (common practice)', () => {
    for (const c of byFn('equivalent_tx_power_mw')) {
      const pDbm = 10 * Math.log10(c.inputs.p_mw!)
      const base = freeSpaceInput({ f_mhz: 2440, pt_dbm: pDbm, gt_dbi: 2, gr_dbi: 2, lcables_db: 1, sens_dbm: -100 }, 1000)
      within(planLink({ ...base, tradeDb: c.inputs.gain_change_db }).withPower.txPowerMw, c)
    }
  })

  it('reports EIRP as conducted power plus transmit gain (EIRP definition, cable loss not subtracted)', () => {
    const base = freeSpaceInput({ f_mhz: 2440, pt_dbm: 20, gt_dbi: 2, gr_dbi: 2, lcables_db: 1, sens_dbm: -100 }, 1000)
    expect(planLink(base).eirpDbm).toBeCloseTo(22, 9)
  })
})

describe('planLink', () => {
  const base = freeSpaceInput({ f_mhz: 2440, pt_dbm: 14, gt_dbi: 2, gr_dbi: 2, lcables_db: 1, sens_dbm: -105, fade_margin_db: 10 }, 3000)

  it('asks for exactly the power that puts the target at the predicted range', () => {
    const plan = planLink(base)
    const again = planLink({ ...base, radio: { ...base.radio, txPowerDbm: plan.txPowerForTargetDbm } })
    expect(again.rangeM).toBeCloseTo(3000, 6)
  })

  it('shifts a flight model by the changed budget terms', () => {
    const measured = { interceptDbm: -38, exponent: 2.5, referenceDistanceM: 1, txPowerDbm: 14, txGainDbi: 2, rxGainDbi: 2, cableLossDb: 1 }
    const a = planLink({ ...base, measured })
    const b = planLink({ ...base, measured, radio: { ...base.radio, txPowerDbm: 24 } })
    expect(b.model.interceptDbm - a.model.interceptDbm).toBeCloseTo(10, 9)
    // 10 dB at n = 2.5 is 10^(10/25) ≈ 2.512x the range (log-distance model)
    expect(b.rangeM / a.rangeM).toBeCloseTo(2.51188643151, 9)
  })

  it('shows gain and power buying the same range, with only the power raising EIRP', () => {
    const plan = planLink({ ...base, limits: POWER_LIMIT_PRESETS.find((p) => p.id === 'eu-2g4')!.limits })
    expect(plan.withGain.rangeM).toBeCloseTo(plan.withPower.rangeM, 9)
    expect(plan.withGain.eirpDbm).toBeCloseTo(16, 9)
    expect(plan.withPower.eirpDbm).toBeCloseTo(26, 9)
    expect(plan.withGain.exceedsLimit).toBe(false)
    expect(plan.withPower.exceedsLimit).toBe(true)
  })

  it('gives a directional antenna beam width in metres at the target', () => {
    const plan = planLink({ ...base, radio: { ...base.radio, rxKind: 'directional', rxGainDbi: 10, rxBeamwidthDeg: 60 } })
    // plane geometry: 2·3000·tan(30°)
    expect(plan.beam!.widthAtTargetM).toBeCloseTo(2 * 3000 * Math.tan(Math.PI / 6), 6)
    expect(planLink(base).beam).toBeNull()
  })

  it('rejects a non-positive target range', () => {
    expect(() => planLink({ ...base, targetRangeM: 0 })).toThrow(/targetRangeM/)
  })
})
