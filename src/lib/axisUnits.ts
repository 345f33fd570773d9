import { METRES_PER_FOOT, METRES_PER_MILE } from '@shared/units/length'
import type { UnitSystem } from '@shared/types/api'

/** The unit a distance axis is labelled in and the factor from metres to it. */
export interface AxisUnit {
  unit: string
  perMetre: number
}

/**
 * Picks a distance axis unit for a span: km or mi for long courses, m or ft for short ones.
 * @param maxM the largest distance on the axis, metres
 */
export function distanceAxisUnit(maxM: number, system: UnitSystem): AxisUnit {
  if (system === 'imperial') {
    return maxM >= 0.5 * METRES_PER_MILE ? { unit: 'mi', perMetre: 1 / METRES_PER_MILE } : { unit: 'ft', perMetre: 1 / METRES_PER_FOOT }
  }
  return maxM >= 2000 ? { unit: 'km', perMetre: 1 / 1000 } : { unit: 'm', perMetre: 1 }
}

/** Height axis unit: m or ft. */
export function heightAxisUnit(system: UnitSystem): AxisUnit {
  return system === 'imperial' ? { unit: 'ft', perMetre: 1 / METRES_PER_FOOT } : { unit: 'm', perMetre: 1 }
}
