import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../units/guards.js'
import { beamwidthFromGainDeg } from '../antenna/beamwidth.js'
import { type FlightInput } from './types.js'

const DEG = Math.PI / 180

/** Receive antennas resolved for the per-sample loop. */
export interface ResolvedAntennas {
  count: number
  gainDbi: Float64Array
  /** 1 for directional antennas. */
  directional: Uint8Array
  beamwidthDeg: Float64Array
  /** Boresight unit vector (east, north, up). */
  bx: Float64Array
  by: Float64Array
  bz: Float64Array
  maxGainDbi: number
  anyDirectional: boolean
}

/**
 * Checks a flight input once (so the hot loops need no checks) and resolves antenna boresights.
 * @param input flight samples, station, setup, obstacles
 * @returns antennas as typed arrays with unit boresight vectors; beamwidth estimated from gain when absent
 * @throws RangeError/TypeError naming the first bad field
 */
export function validateFlightInput(input: FlightInput): ResolvedAntennas {
  const { samples: s, station, setup } = input
  const len = s.timeMs.length
  const arrays: Array<[string, Float64Array | undefined]> = [
    ['samples.latDeg', s.latDeg],
    ['samples.lonDeg', s.lonDeg],
    ['samples.altM', s.altM],
    ['samples.rssiDbm', s.rssiDbm],
    ['samples.rssi2Dbm', s.rssi2Dbm],
    ['samples.lqPct', s.lqPct],
    ['samples.snrDb', s.snrDb],
  ]
  if (!(s.timeMs instanceof Float64Array)) throw new TypeError('samples.timeMs must be a Float64Array')
  for (const [name, arr] of arrays) {
    if (arr === undefined && name !== 'samples.latDeg' && name !== 'samples.lonDeg' && name !== 'samples.altM' && name !== 'samples.rssiDbm') continue
    if (!(arr instanceof Float64Array)) throw new TypeError(`${name} must be a Float64Array`)
    if (arr.length !== len) throw new RangeError(`${name} must have ${len} entries, got ${arr.length}`)
  }
  requireInRange('station.latDeg', station.latDeg, -90, 90)
  requireInRange('station.lonDeg', station.lonDeg, -180, 180)
  requirePositive('station.antennaHeightM', station.antennaHeightM)
  requireFinite('station.groundElevM', station.groundElevM)
  if (input.altitudeReference !== 'AGL' && input.altitudeReference !== 'AMSL') {
    throw new TypeError(`altitudeReference must be 'AGL' or 'AMSL', got ${String(input.altitudeReference)}`)
  }
  requirePositive('setup.freqMHz', setup.freqMHz)
  requireFinite('setup.txPowerDbm', setup.txPowerDbm)
  requireFinite('setup.txGainDbi', setup.txGainDbi)
  requireNonNegative('setup.cableLossDb', setup.cableLossDb)
  requireFinite('setup.sensitivityDbm', setup.sensitivityDbm)
  if (setup.floorDbm !== undefined && setup.floorDbm !== null) requireFinite('setup.floorDbm', setup.floorDbm)
  const ants = setup.rxAntennas
  if (!Array.isArray(ants) || ants.length < 1 || ants.length > 2) {
    throw new RangeError('setup.rxAntennas must hold one or two antennas')
  }
  if (ants.length === 2 && !s.rssi2Dbm) throw new RangeError('samples.rssi2Dbm is required with two rxAntennas')
  const n = ants.length
  const out: ResolvedAntennas = {
    count: n,
    gainDbi: new Float64Array(n),
    directional: new Uint8Array(n),
    beamwidthDeg: new Float64Array(n),
    bx: new Float64Array(n),
    by: new Float64Array(n),
    bz: new Float64Array(n),
    maxGainDbi: -Infinity,
    anyDirectional: false,
  }
  ants.forEach((a, i) => {
    const g = requireFinite(`setup.rxAntennas[${i}].gainDbi`, a.gainDbi)
    out.gainDbi[i] = g
    out.maxGainDbi = Math.max(out.maxGainDbi, g)
    if (a.kind === 'omni') return
    if (a.kind !== 'directional') throw new TypeError(`setup.rxAntennas[${i}].kind must be 'omni' or 'directional'`)
    out.directional[i] = 1
    out.anyDirectional = true
    const bw = a.beamwidthDeg ?? beamwidthFromGainDeg(g)
    out.beamwidthDeg[i] = requireInRange(`setup.rxAntennas[${i}].beamwidthDeg`, bw, 1e-3, 360)
    if (a.azimuthDeg === undefined) throw new RangeError(`setup.rxAntennas[${i}].azimuthDeg is required for a directional antenna`)
    const az = requireFinite(`setup.rxAntennas[${i}].azimuthDeg`, a.azimuthDeg) * DEG
    const el = requireInRange(`setup.rxAntennas[${i}].elevationDeg`, a.elevationDeg ?? 0, -90, 90) * DEG
    out.bx[i] = Math.cos(el) * Math.sin(az)
    out.by[i] = Math.cos(el) * Math.cos(az)
    out.bz[i] = Math.sin(el)
  })
  return out
}
