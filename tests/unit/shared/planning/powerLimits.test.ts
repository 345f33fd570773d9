import { describe, expect, it } from 'vitest'
import { checkPowerLimits, POWER_LIMIT_PRESETS, presetsForFrequency } from '../../../../shared/planning/powerLimits.js'

describe('POWER_LIMIT_PRESETS', () => {
  it('names a regulation and asks to verify for every preset, and says when recalled', () => {
    for (const p of POWER_LIMIT_PRESETS) {
      expect(p.regulation.length).toBeGreaterThan(5)
      expect(p.note).toMatch(/regulator/)
      if (p.recalledFromMemory) expect(p.note).toMatch(/recalled from memory/i)
      expect(p.limits.length).toBeGreaterThan(0)
    }
  })
})

describe('checkPowerLimits', () => {
  it('compares ERP limits against EIRP − 2.15 dB', () => {
    const [c] = checkPowerLimits([{ basis: 'erp', maxDbm: 14 }], 14, 16.15)
    expect(c!.planDbm).toBeCloseTo(14, 9)
    expect(c!.exceeded).toBe(false)
    expect(checkPowerLimits([{ basis: 'erp', maxDbm: 14 }], 14, 16.5)[0]!.exceeded).toBe(true)
  })
  it('checks conducted and EIRP limits separately', () => {
    const checks = checkPowerLimits([{ basis: 'conducted', maxDbm: 30 }, { basis: 'eirp', maxDbm: 36 }], 30, 38)
    expect(checks.map((c) => c.exceeded)).toEqual([false, true])
    expect(checks[1]!.headroomDb).toBeCloseTo(-2, 9)
  })
})

describe('presetsForFrequency', () => {
  it('finds the EU and US 2.4 GHz presets at 2440 MHz', () => {
    expect(presetsForFrequency(2440).map((p) => p.id).sort()).toEqual(['eu-2g4', 'us-2g4'])
  })
})
