import { eirpDbm } from '../rf/linkBudget.js'
import { dbmToMw, mwToDbm } from '../units/power.js'
import { requireFinite } from '../units/guards.js'
import type { AntennaKind, Polarisation, RxAntenna } from '../types/setup.js'
import { estimateBeamwidthDeg } from './beamwidth.js'

export type PowerUnit = 'mW' | 'dBm'

/** A transmit power in both units. */
export interface PowerBoth {
  powerDbm: number
  powerMw: number
}

/**
 * A transmit power entered in mW or dBm, in both units.
 * @param value the number typed, > 0 for mW, finite for dBm
 * @param unit 'mW' or 'dBm'
 * @returns the power in dBm and in mW
 * @throws RangeError when the value is not valid for its unit
 */
export function powerFromInput(value: number, unit: PowerUnit): PowerBoth {
  if (unit === 'mW') return { powerDbm: mwToDbm(value), powerMw: value }
  return { powerDbm: requireFinite('powerDbm', value), powerMw: dbmToMw(value) }
}

/**
 * EIRP of a setup. The stored cable loss is the transmit and receive sides together, so none of it is
 * subtracted here: the figure is an upper bound, which is the safe side when comparing with a limit.
 * @param txPowerDbm conducted transmit power in dBm, finite
 * @param txGainDbi transmit antenna gain in dBi, finite
 * @returns EIRP in dBm
 * @throws RangeError when a value is not finite
 */
export function setupEirpDbm(txPowerDbm: number, txGainDbi: number): number {
  return eirpDbm(txPowerDbm, txGainDbi, 0)
}

/** A receive antenna as entered: beamwidth may be blank, pointing may be blank for an omni. */
export interface RxAntennaEntry {
  label: string
  type: string
  kind: AntennaKind
  gainDbi: number
  beamwidthDeg: number | null
  azimuthDeg: number | null
  elevationDeg: number | null
  polarisation: Polarisation
}

/**
 * Completes a receive antenna: a blank beamwidth is estimated from the gain and marked estimated;
 * an omni carries no pointing.
 * @param a the antenna as entered; gainDbi finite
 * @param index position in the list, used for a default label ("Rx 1", "Rx 2")
 * @returns the antenna as stored
 * @throws RangeError when the gain is not finite
 */
export function resolveRxAntenna(a: RxAntennaEntry, index: number): RxAntenna {
  const estimated = a.beamwidthDeg === null
  const beamwidthDeg = estimated ? round1(estimateBeamwidthDeg(a.kind, a.gainDbi)) : a.beamwidthDeg
  const directional = a.kind === 'directional'
  return {
    label: a.label.trim() || `Rx ${index + 1}`,
    type: a.type,
    kind: a.kind,
    gainDbi: a.gainDbi,
    beamwidthDeg,
    beamwidthEstimated: estimated,
    azimuthDeg: directional ? a.azimuthDeg : null,
    elevationDeg: directional ? a.elevationDeg : null,
    polarisation: a.polarisation,
  }
}

function round1(x: number): number {
  return Math.round(x * 10) / 10
}
