import { requireFinite } from '../units/guards.js'

/** What a limit is measured as: conducted at the antenna port, EIRP, or ERP (relative to a half-wave dipole). */
export type LimitBasis = 'conducted' | 'eirp' | 'erp'

/** One numeric limit of a preset. */
export interface PowerLimit {
  basis: LimitBasis
  /** Maximum power on that basis, dBm. */
  maxDbm: number
}

/** A regional power limit for a band, as the planner offers it. */
export interface PowerLimitPreset {
  id: string
  label: string
  region: string
  /** Band edges, MHz. */
  freqMinMHz: number
  freqMaxMHz: number
  /** All must hold (some rules cap both conducted power and EIRP). */
  limits: PowerLimit[]
  /** The document the value comes from. */
  regulation: string
  /** True when the value was recalled rather than looked up in the document. */
  recalledFromMemory: boolean
  /** Caveats shown with the preset. */
  note: string
}

/** ERP is referenced to a half-wave dipole, 2.15 dBi: EIRP = ERP + 2.15 dB (IEEE Std 145). */
export const DIPOLE_GAIN_DBI = 2.15

const VERIFY =
  'Verify with your national regulator before flying: duty cycle, channel access, sub-band and licence conditions also apply.'
const RECALLED = 'Value recalled from memory, not looked up in the document.'

/** Presets shipped with the planner; users pick one or edit their own copy. */
export const POWER_LIMIT_PRESETS: readonly PowerLimitPreset[] = Object.freeze([
  {
    id: 'eu-2g4',
    label: 'EU 2.4 GHz wideband: 100 mW EIRP',
    region: 'EU/CEPT',
    freqMinMHz: 2400,
    freqMaxMHz: 2483.5,
    limits: [{ basis: 'eirp', maxDbm: 20 }],
    regulation: 'ETSI EN 300 328',
    recalledFromMemory: true,
    note: `${RECALLED} ${VERIFY}`,
  },
  {
    id: 'eu-868-g1',
    label: 'EU 868 MHz SRD (band g1): 25 mW ERP',
    region: 'EU/CEPT',
    freqMinMHz: 868.0,
    freqMaxMHz: 868.6,
    limits: [{ basis: 'erp', maxDbm: 14 }],
    regulation: 'ERC Recommendation 70-03, Annex 1, band g1',
    recalledFromMemory: true,
    note: `${RECALLED} Other 863–870 MHz sub-bands carry different powers and duty cycles. ${VERIFY}`,
  },
  {
    id: 'eu-5g8',
    label: 'EU 5.8 GHz SRD: 25 mW EIRP',
    region: 'EU/CEPT',
    freqMinMHz: 5725,
    freqMaxMHz: 5875,
    limits: [{ basis: 'eirp', maxDbm: 14 }],
    regulation: 'ETSI EN 300 440',
    recalledFromMemory: true,
    note: `${RECALLED} Amateur-radio licences allow more in parts of this band under their own rules. ${VERIFY}`,
  },
  {
    id: 'us-2g4',
    label: 'US 2.4 GHz: 1 W conducted, 4 W EIRP',
    region: 'US',
    freqMinMHz: 2400,
    freqMaxMHz: 2483.5,
    limits: [
      { basis: 'conducted', maxDbm: 30 },
      { basis: 'eirp', maxDbm: 36 },
    ],
    regulation: 'FCC 47 CFR Part 15.247',
    recalledFromMemory: true,
    note: `${RECALLED} Above 6 dBi antenna gain the conducted limit falls; point-to-point links have their own rule. ${VERIFY}`,
  },
  {
    id: 'us-915',
    label: 'US 902–928 MHz: 1 W conducted, 4 W EIRP',
    region: 'US',
    freqMinMHz: 902,
    freqMaxMHz: 928,
    limits: [
      { basis: 'conducted', maxDbm: 30 },
      { basis: 'eirp', maxDbm: 36 },
    ],
    regulation: 'FCC 47 CFR Part 15.247',
    recalledFromMemory: true,
    note: `${RECALLED} The 1 W figure assumes enough hopping channels or digital modulation; fewer channels allow less. ${VERIFY}`,
  },
])

/** One limit checked against a plan. */
export interface LimitCheck {
  basis: LimitBasis
  maxDbm: number
  /** The plan's power on the same basis, dBm. */
  planDbm: number
  /** maxDbm − planDbm; negative when exceeded. */
  headroomDb: number
  exceeded: boolean
}

/**
 * Checks a plan's conducted power and EIRP against every limit of a preset.
 * @param limits the preset's limits (dBm on their basis)
 * @param txPowerDbm conducted transmit power, dBm, finite
 * @param eirpDbm EIRP of the plan, dBm, finite
 * @returns one check per limit; exceeded when the plan is above the limit by more than 0.005 dB
 * @throws RangeError when a power is not finite
 */
export function checkPowerLimits(limits: readonly PowerLimit[], txPowerDbm: number, eirpDbm: number): LimitCheck[] {
  requireFinite('txPowerDbm', txPowerDbm)
  requireFinite('eirpDbm', eirpDbm)
  return limits.map((l) => {
    requireFinite('limit.maxDbm', l.maxDbm)
    // ERP = EIRP − 2.15 dB (half-wave dipole reference)
    const planDbm = l.basis === 'conducted' ? txPowerDbm : l.basis === 'eirp' ? eirpDbm : eirpDbm - DIPOLE_GAIN_DBI
    const headroomDb = l.maxDbm - planDbm
    return { basis: l.basis, maxDbm: l.maxDbm, planDbm, headroomDb, exceeded: headroomDb < -0.005 }
  })
}

/**
 * Presets whose band contains a frequency.
 * @param freqMHz carrier frequency in MHz, finite
 * @returns matching presets, possibly none
 * @throws RangeError when freqMHz is not finite
 */
export function presetsForFrequency(freqMHz: number): PowerLimitPreset[] {
  requireFinite('freqMHz', freqMHz)
  return POWER_LIMIT_PRESETS.filter((p) => freqMHz >= p.freqMinMHz && freqMHz <= p.freqMaxMHz)
}
