import { requireInRange, requirePositive } from '../units/guards.js'

/** How the aircraft flies the route. */
export interface FlightProfile {
  /** Ground speed in cruise, m/s, > 0 (model aircraft: 10–25). */
  speedMps: number
  /** Cruise height above ground, m, > 0. */
  cruiseAltM: number
  /** Climb and descent rate, m/s, > 0 (default 3). */
  climbMps?: number
  /** Telemetry rate, Hz, in [1, 50] (default 10). */
  sampleHz?: number
  /** Slow height wander in cruise, m, >= 0 (default 3): pilots never hold height exactly. */
  altWanderM?: number
}

/** Positions of a generated flight in a local plane around the ground station. */
export interface FlightTrack {
  timeMs: Float64Array
  eastM: Float64Array
  northM: Float64Array
  /** Height above ground, m. */
  altM: Float64Array
  /** Distance travelled along the track, m. */
  travelledM: Float64Array
}

/**
 * Flies the waypoints out and back (takeoff at the first, turn at the last) at a steady speed with climb and descent.
 * @param waypointsEn waypoints as [eastM, northM] from the station; at least 2, with non-zero total length
 * @param profile speed (m/s), cruise height (m), climb rate (m/s), sample rate (Hz)
 * @returns per-sample time (ms from start), position (m) and height above ground (m)
 * @throws RangeError when the waypoints or the profile are out of range
 */
export function flyOutAndBack(waypointsEn: ReadonlyArray<readonly [number, number]>, profile: FlightProfile): FlightTrack {
  if (waypointsEn.length < 2) throw new RangeError('waypointsEn must hold at least 2 points')
  const speed = requirePositive('profile.speedMps', profile.speedMps)
  const cruise = requirePositive('profile.cruiseAltM', profile.cruiseAltM)
  const climb = requirePositive('profile.climbMps', profile.climbMps ?? 3)
  const hz = requireInRange('profile.sampleHz', profile.sampleHz ?? 10, 1, 50)
  const wander = requireInRange('profile.altWanderM', profile.altWanderM ?? 3, 0, 1000)
  const legs = [...waypointsEn, ...waypointsEn.slice(0, -1).reverse()]
  const cum = [0]
  for (let k = 1; k < legs.length; k++) {
    cum.push(cum[k - 1]! + Math.hypot(legs[k]![0] - legs[k - 1]![0], legs[k]![1] - legs[k - 1]![1]))
  }
  const totalM = cum[cum.length - 1]!
  if (!(totalM > 0)) throw new RangeError('waypointsEn must not all coincide')
  const durationS = totalM / speed
  const n = Math.floor(durationS * hz) + 1
  const track: FlightTrack = {
    timeMs: new Float64Array(n),
    eastM: new Float64Array(n),
    northM: new Float64Array(n),
    altM: new Float64Array(n),
    travelledM: new Float64Array(n),
  }
  let leg = 1
  for (let i = 0; i < n; i++) {
    const tS = i / hz
    const s = Math.min(totalM, tS * speed)
    while (leg < legs.length - 1 && cum[leg]! < s) leg++
    const a = legs[leg - 1]!
    const b = legs[leg]!
    const span = cum[leg]! - cum[leg - 1]!
    const f = span > 0 ? (s - cum[leg - 1]!) / span : 0
    track.timeMs[i] = Math.round(tS * 1000)
    track.eastM[i] = a[0] + (b[0] - a[0]) * f
    track.northM[i] = a[1] + (b[1] - a[1]) * f
    track.travelledM[i] = s
    // climb out, cruise with a slow wander, descend to land back at the start
    const ramp = Math.min(climb * tS, climb * (durationS - tS))
    const cruiseHere = cruise + wander * Math.sin((2 * Math.PI * s) / 700)
    track.altM[i] = Math.max(0.5, Math.min(ramp, cruiseHere))
  }
  return track
}
