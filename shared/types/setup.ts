export type AntennaKind = 'omni' | 'directional'
export type Polarisation = 'vertical' | 'horizontal' | 'rhcp' | 'lhcp' | 'linear-other'
export const POLARISATIONS: readonly Polarisation[] = ['vertical', 'horizontal', 'rhcp', 'lhcp', 'linear-other']

export interface TxAntenna {
  type: string
  gainDbi: number
}

export interface RxAntenna {
  label: string
  type: string
  kind: AntennaKind
  gainDbi: number
  /** Half-power beamwidth, degrees; for an omni the elevation-plane width. */
  beamwidthDeg: number | null
  /** True when beamwidthDeg was estimated from the gain because it was left blank. */
  beamwidthEstimated: boolean
  /** Pointing of a directional antenna: true bearing and elevation, degrees; null for an omni. */
  azimuthDeg: number | null
  elevationDeg: number | null
  polarisation: Polarisation
}

export interface LinkSetupDto {
  id: number
  teamId: number
  createdBy: number | null
  /** Id of the first version; the same for every version of one setup. */
  lineageId: number
  version: number
  isCurrent: boolean
  name: string
  band: string
  freqMHz: number
  channel: string | null
  txPowerDbm: number
  txPowerMw: number
  txAntenna: TxAntenna
  rxAntennas: RxAntenna[]
  /** Cable and connector losses, transmit and receive side together, dB. */
  cableLossDb: number
  sensitivityDbm: number
  /** The value the log writes when there is no signal, dBm; null when the log has none. */
  floorDbm: number | null
  notes: string
  /** Transmit power + transmit antenna gain, dBm (see shared/setup/derive.ts). */
  eirpDbm: number
  /** True when at least one flight points at this version (edits then create a new version). */
  inUse: boolean
  createdAt: string
}

export const SETUP_SORT_KEYS = ['name', 'band', 'freqMHz', 'createdAt'] as const
export type SetupSortKey = (typeof SETUP_SORT_KEYS)[number]

/** Frequency bands offered in the form, with a default centre frequency. */
export const BANDS: readonly { band: string; defaultFreqMHz: number }[] = [
  { band: '433 MHz', defaultFreqMHz: 433.9 },
  { band: '868 MHz', defaultFreqMHz: 868 },
  { band: '915 MHz', defaultFreqMHz: 915 },
  { band: '1.3 GHz', defaultFreqMHz: 1280 },
  { band: '2.4 GHz', defaultFreqMHz: 2440 },
  { band: '5.8 GHz', defaultFreqMHz: 5800 },
]
