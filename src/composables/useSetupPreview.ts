import { computed, type Ref } from 'vue'
import type { AntennaKind } from '@shared/types/setup'
import { estimateBeamwidthDeg } from '@shared/setup/beamwidth'
import { powerFromInput, setupEirpDbm, type PowerUnit } from '@shared/setup/derive'
import { dbmToMw } from '@shared/units/power'

/** The parts of the setup form the live figures depend on. */
export interface SetupPreviewInput {
  power: number | null
  powerUnit: PowerUnit
  txGainDbi: number | null
  rx: { kind: AntennaKind; gainDbi: number | null; beamwidthDeg: number | null }[]
}

/** Live figures shown beside the form; null parts mean "not computable from what is typed". */
export interface SetupPreview {
  txPowerDbm: number | null
  txPowerMw: number | null
  eirpDbm: number | null
  eirpMw: number | null
  /** Per receive antenna: the text shown for its beamwidth and whether it is an estimate. */
  beamwidths: { text: string; estimated: boolean }[]
}

/** mW with sensible precision: 0.5 mW, 25 mW, 1000 mW. */
export function formatMw(mw: number): string {
  if (mw < 1) return `${mw.toFixed(2)} mW`
  if (mw < 10) return `${mw.toFixed(1)} mW`
  return `${Math.round(mw)} mW`
}

/**
 * Computes the live figures of a setup form: power in both units, EIRP (power + Tx gain), and each
 * receive antenna's beamwidth, estimated from the gain when left blank.
 */
export function previewSetup(f: SetupPreviewInput): SetupPreview {
  let txPowerDbm: number | null = null
  let txPowerMw: number | null = null
  try {
    if (f.power !== null && Number.isFinite(f.power)) {
      const p = powerFromInput(f.power, f.powerUnit)
      txPowerDbm = p.powerDbm
      txPowerMw = p.powerMw
    }
  } catch {
    // 0 or negative mW: no dBm value exists; the form rule reports it
  }
  const eirpDbm = txPowerDbm !== null && f.txGainDbi !== null && Number.isFinite(f.txGainDbi) ? setupEirpDbm(txPowerDbm, f.txGainDbi) : null
  const beamwidths = f.rx.map((a) => {
    if (a.beamwidthDeg !== null && a.beamwidthDeg > 0) return { text: `${a.beamwidthDeg}°`, estimated: false }
    if (a.gainDbi === null || !Number.isFinite(a.gainDbi)) return { text: '—', estimated: true }
    return { text: `≈ ${Math.round(estimateBeamwidthDeg(a.kind, a.gainDbi))}°`, estimated: true }
  })
  return { txPowerDbm, txPowerMw, eirpDbm, eirpMw: eirpDbm === null ? null : dbmToMw(eirpDbm), beamwidths }
}

/** previewSetup as a computed over the reactive form. */
export function useSetupPreview(form: Ref<SetupPreviewInput> | (() => SetupPreviewInput)) {
  return computed(() => previewSetup(typeof form === 'function' ? form() : form.value))
}
