import { computed } from 'vue'
import { storeToRefs } from 'pinia'
import { formatDistance, formatHeight, METRES_PER_FOOT, METRES_PER_MILE } from '@shared/units/index'
import type { UnitSystem } from '@shared/types/api'
import { useAuthStore } from '@/stores/auth'

const SECONDS_PER_HOUR = 3600

/** Speed in km/h (metric) or mph (imperial), one decimal. */
export function formatSpeed(speedMS: number, system: UnitSystem): string {
  if (!Number.isFinite(speedMS)) throw new RangeError(`speedMS must be finite, got ${speedMS}`)
  const perHour = speedMS * SECONDS_PER_HOUR
  return system === 'imperial'
    ? `${(perHour / METRES_PER_MILE).toFixed(1)} mph`
    : `${(perHour / 1000).toFixed(1)} km/h`
}

/** Converts a height in metres to the display unit's number (m or ft). */
export function heightIn(heightM: number, system: UnitSystem): number {
  return system === 'imperial' ? heightM / METRES_PER_FOOT : heightM
}

/** Converts a display-unit height (m or ft) back to metres, e.g. for form input. */
export function heightToM(value: number, system: UnitSystem): number {
  return system === 'imperial' ? value * METRES_PER_FOOT : value
}

/**
 * Unit formatting in the signed-in user's preference (metric when nobody is signed in).
 * Every function takes SI values (metres, metres per second).
 */
export function useUnits() {
  const { units } = storeToRefs(useAuthStore())
  return {
    system: units,
    heightUnit: computed(() => (units.value === 'imperial' ? 'ft' : 'm')),
    speedUnit: computed(() => (units.value === 'imperial' ? 'mph' : 'km/h')),
    distance: (distanceM: number, digits = 2) => formatDistance(distanceM, units.value, digits),
    height: (heightM: number) => formatHeight(heightM, units.value),
    speed: (speedMS: number) => formatSpeed(speedMS, units.value),
    heightIn: (heightM: number) => heightIn(heightM, units.value),
    heightToM: (value: number) => heightToM(value, units.value),
  }
}
