import { requireFinite, requireInRange } from './guards.js'
import { METRES_PER_FOOT, METRES_PER_MILE } from './length.js'
import { dbmToMw } from './power.js'

/** Unit system for display. */
export type UnitSystem = 'metric' | 'imperial'

/**
 * Formats a distance for display: m/km in metric, ft/mi in imperial.
 * @param distanceM distance in metres, finite
 * @param system 'metric' or 'imperial'
 * @param digits decimals for the large unit (km or mi), integer in [0, 6]
 * @returns text such as "850 m", "1.25 km", "2789 ft" or "0.78 mi"
 * @throws RangeError when distanceM is not finite or digits is out of range; TypeError for an unknown system
 */
export function formatDistance(distanceM: number, system: UnitSystem, digits = 2): string {
  requireFinite('distanceM', distanceM)
  requireInRange('digits', digits, 0, 6)
  if (system === 'metric') {
    // switch at 1 km so short hops read in whole metres
    return Math.abs(distanceM) < 1000
      ? `${Math.round(distanceM)} m`
      : `${(distanceM / 1000).toFixed(digits)} km`
  }
  if (system === 'imperial') {
    // a tenth of a mile is the usual switch point for field distances
    const miles = distanceM / METRES_PER_MILE
    return Math.abs(miles) < 0.1
      ? `${Math.round(distanceM / METRES_PER_FOOT)} ft`
      : `${miles.toFixed(digits)} mi`
  }
  throw new TypeError(`system must be 'metric' or 'imperial', got ${String(system)}`)
}

/**
 * Formats a height for display in m (metric) or ft (imperial), rounded to whole units.
 * @param heightM height in metres, finite
 * @param system 'metric' or 'imperial'
 * @returns text such as "120 m" or "394 ft"
 * @throws RangeError when heightM is not finite; TypeError for an unknown system
 */
export function formatHeight(heightM: number, system: UnitSystem): string {
  requireFinite('heightM', heightM)
  if (system === 'metric') return `${Math.round(heightM)} m`
  if (system === 'imperial') return `${Math.round(heightM / METRES_PER_FOOT)} ft`
  throw new TypeError(`system must be 'metric' or 'imperial', got ${String(system)}`)
}

/**
 * Formats a power as dBm with milliwatts (or watts from 1 W) alongside.
 * @param powerDbm power in dBm, finite
 * @returns text such as "20.0 dBm (100 mW)" or "30.0 dBm (1.00 W)"
 * @throws RangeError when powerDbm is not finite
 */
export function formatPower(powerDbm: number): string {
  const mw = dbmToMw(powerDbm)
  const linear =
    mw >= 1000 ? `${(mw / 1000).toFixed(2)} W` : mw >= 1 ? `${Math.round(mw)} mW` : `${mw.toPrecision(2)} mW`
  return `${powerDbm.toFixed(1)} dBm (${linear})`
}
