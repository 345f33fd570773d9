import { gainOffBoresightDbi } from '../antenna/pattern.js'
import { offBoresightAngleDeg } from '../geo/boresight.js'
import { estimateBeamwidthDeg } from '../setup/beamwidth.js'
import { medianOf } from '../stats/median.js'
import { requireFinite } from '../units/guards.js'

/** The datasheet terms of a setup that set its link budget. */
export interface SetupBudgetTerms {
  txPowerDbm: number
  txGainDbi: number
  cableLossDb: number
  rxAntennas: ReadonlyArray<{
    kind: 'omni' | 'directional'
    gainDbi: number
    beamwidthDeg: number | null
    azimuthDeg: number | null
    elevationDeg: number | null
  }>
}

/** Where the aircraft typically was, seen from the ground antenna. */
export interface TypicalDirection {
  azimuthDeg: number
  elevationDeg: number
}

/**
 * Receive gain toward a direction: the best antenna, a directional one reduced by its main-lobe pattern.
 * @param setup receive antennas (gains dBi, beamwidths and pointing in degrees)
 * @param direction azimuth (deg from north) and elevation (deg) of the aircraft
 * @returns gain in dBi
 * @throws RangeError when a value is out of range
 */
export function effectiveRxGainDbi(setup: SetupBudgetTerms, direction: TypicalDirection): number {
  let best = -Infinity
  for (const a of setup.rxAntennas) {
    requireFinite('gainDbi', a.gainDbi)
    let g = a.gainDbi
    if (a.kind === 'directional') {
      const bw = a.beamwidthDeg ?? estimateBeamwidthDeg('directional', a.gainDbi)
      const off = offBoresightAngleDeg(a.azimuthDeg ?? 0, a.elevationDeg ?? 0, direction.azimuthDeg, direction.elevationDeg)
      // parabolic main lobe (3GPP TR 36.942 §4.2.1.1) via the core
      g = gainOffBoresightDbi(a.gainDbi, off, bw)
    }
    if (g > best) best = g
  }
  if (!Number.isFinite(best)) throw new RangeError('setup.rxAntennas must hold at least one antenna')
  return best
}

/**
 * Advantage the datasheets predict for `other` over `base`: the difference in conducted power + transmit gain −
 * cable loss + receive gain toward each flight's typical direction.
 * @param base baseline setup terms (dBm, dBi, dB)
 * @param other compared setup terms
 * @param baseDirection typical direction of the baseline flight (deg)
 * @param otherDirection typical direction of the compared flight (deg)
 * @returns predicted advantage in dB
 * @throws RangeError when a value is out of range
 */
export function predictedAdvantageDb(
  base: SetupBudgetTerms,
  other: SetupBudgetTerms,
  baseDirection: TypicalDirection,
  otherDirection: TypicalDirection,
): number {
  // link budget: Pr = Pt + Gt + Gr − L − PL; PL cancels at matched distance
  const budget = (s: SetupBudgetTerms, d: TypicalDirection) =>
    s.txPowerDbm + s.txGainDbi - s.cableLossDb + effectiveRxGainDbi(s, d)
  return budget(other, otherDirection) - budget(base, baseDirection)
}

/**
 * Typical direction of a flight from the ground antenna: the circular mean azimuth and the median elevation of
 * samples beyond a minimum distance.
 * @param eastM per-sample metres east of the station (NaN = no fix)
 * @param northM per-sample metres north of the station
 * @param heightAboveAntennaM per-sample aircraft height above the ground antenna, m
 * @param minDistanceM samples nearer than this are ignored, m (default 30)
 * @returns the direction, or null when no sample qualifies
 * @throws RangeError when lengths differ
 */
export function typicalDirection(
  eastM: Float64Array,
  northM: Float64Array,
  heightAboveAntennaM: Float64Array,
  minDistanceM = 30,
): TypicalDirection | null {
  if (northM.length !== eastM.length || heightAboveAntennaM.length !== eastM.length) {
    throw new RangeError('eastM, northM and heightAboveAntennaM must have the same length')
  }
  let sx = 0
  let sy = 0
  const elev = new Float64Array(eastM.length)
  let count = 0
  for (let i = 0; i < eastM.length; i++) {
    const e = eastM[i]!
    const n = northM[i]!
    const h = Math.hypot(e, n)
    if (!Number.isFinite(h) || h < minDistanceM || !Number.isFinite(heightAboveAntennaM[i]!)) continue
    sx += e / h
    sy += n / h
    elev[count++] = (Math.atan2(heightAboveAntennaM[i]!, h) * 180) / Math.PI
  }
  if (count === 0) return null
  return { azimuthDeg: ((Math.atan2(sx, sy) * 180) / Math.PI + 360) % 360, elevationDeg: medianOf(elev, 0, count) }
}
