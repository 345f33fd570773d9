import { describe, expect, it } from 'vitest'
import { ref, nextTick } from 'vue'
import { formatMw, previewSetup, useSetupPreview, type SetupPreviewInput } from '@/composables/useSetupPreview'

const omni = { kind: 'omni' as const, gainDbi: 2.15, beamwidthDeg: null }

describe('previewSetup', () => {
  it('shows 25 mW as 13.98 dBm and EIRP 16.13 dBm with a 2.15 dBi antenna', () => {
    const p = previewSetup({ power: 25, powerUnit: 'mW', txGainDbi: 2.15, rx: [omni] })
    expect(p.txPowerDbm).toBeCloseTo(13.98, 2)
    expect(p.eirpDbm).toBeCloseTo(16.13, 2)
    // 10^(16.13/10) ≈ 41 mW
    expect(p.eirpMw).toBeCloseTo(41.0, 0)
  })
  it('reads dBm input and gives mW', () => {
    expect(previewSetup({ power: 20, powerUnit: 'dBm', txGainDbi: 0, rx: [] }).txPowerMw).toBeCloseTo(100, 9)
  })
  it('has no EIRP while the power is 0 mW or the gain is blank', () => {
    expect(previewSetup({ power: 0, powerUnit: 'mW', txGainDbi: 2, rx: [] }).eirpDbm).toBeNull()
    expect(previewSetup({ power: 25, powerUnit: 'mW', txGainDbi: null, rx: [] }).eirpDbm).toBeNull()
  })
  it('shows an estimated beamwidth for a blank one and the typed value otherwise', () => {
    const p = previewSetup({
      power: 25,
      powerUnit: 'mW',
      txGainDbi: 2,
      rx: [omni, { kind: 'directional', gainDbi: 10, beamwidthDeg: 40 }, { kind: 'directional', gainDbi: null, beamwidthDeg: null }],
    })
    expect(p.beamwidths).toEqual([
      { text: '≈ 78°', estimated: true },
      { text: '40°', estimated: false },
      { text: '—', estimated: true },
    ])
  })
})

describe('useSetupPreview', () => {
  it('updates EIRP live when the power changes from 25 to 250 mW (+10 dB)', async () => {
    const form = ref<SetupPreviewInput>({ power: 25, powerUnit: 'mW', txGainDbi: 2.15, rx: [omni] })
    const preview = useSetupPreview(form)
    const before = preview.value.eirpDbm!
    form.value.power = 250
    await nextTick()
    expect(preview.value.eirpDbm! - before).toBeCloseTo(10, 9)
  })
})

describe('formatMw', () => {
  it('rounds by magnitude', () => {
    expect([formatMw(0.5), formatMw(2.5), formatMw(250.4)]).toEqual(['0.50 mW', '2.5 mW', '250 mW'])
  })
})
