import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import type { LonLat } from '@shared/types/course'
import { simplifyLine } from '@shared/geo/simplifyLine'
import * as flightsApi from '@/api/flights'
import type { FlightListItemDto, SamplesDto } from '@/api/flights'

/** How many fixes of the track are fetched to build a route from (the server decimates to this). */
export const ROUTE_TRACK_POINTS = 2000
/** Sideways wander in metres the route may ignore: GPS jitter and small corrections, not turns. */
export const ROUTE_TOLERANCE_M = 3

/**
 * Turns a flight's decimated track into a planned route: skips fixes without a position, simplifies the rest and
 * rounds to 6 decimals (about 0.1 m), as typed coordinates are.
 * @returns [lon, lat] pairs, or null when the track has fewer than 2 distinct positions
 */
export function trackToRoute(samples: Pick<SamplesDto, 'lat' | 'lon'>, toleranceM = ROUTE_TOLERANCE_M): LonLat[] | null {
  const coords: [number, number][] = []
  const n = Math.min(samples.lat.length, samples.lon.length)
  for (let i = 0; i < n; i++) {
    const lat = samples.lat[i]
    const lon = samples.lon[i]
    if (lat === null || lon === null || lat === undefined || lon === undefined) continue
    coords.push([lon, lat])
  }
  const r6 = (x: number) => Math.round(x * 1e6) / 1e6
  const line = simplifyLine(coords, toleranceM).map(([lon, lat]) => [r6(lon), r6(lat)] as LonLat)
  return line.length >= 2 ? line : null
}

/** The course editor's “take the route from a flight”: the course's ready flights and the route built from one. */
export const useCourseRouteStore = defineStore('courseRoute', () => {
  const flights = ref<FlightListItemDto[]>([])
  const loadingFlights = ref(false)
  const building = ref(false)

  /** Loads the course's flights that finished importing (newest first), the ones with a track to take. */
  async function fetchFlights(courseId: number): Promise<void> {
    loadingFlights.value = true
    try {
      const res = await flightsApi.listFlights({ courseId, sort: '-flownOn', pageSize: 100 })
      flights.value = res.items.filter((f) => f.status === 'ready')
    } finally {
      loadingFlights.value = false
    }
  }

  /**
   * Fetches the flight's decimated track and simplifies it to a route.
   * @returns the route, or null when the flight has no usable positions
   */
  async function routeFromFlight(flightId: number): Promise<LonLat[] | null> {
    building.value = true
    try {
      return trackToRoute(await flightsApi.getSamples(flightId, 0, undefined, ROUTE_TRACK_POINTS))
    } finally {
      building.value = false
    }
  }

  return { flights, loadingFlights, building, fetchFlights, routeFromFlight }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useCourseRouteStore, import.meta.hot))
