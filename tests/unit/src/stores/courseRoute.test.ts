import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import * as flightsApi from '@/api/flights'
import { emptySamples } from '@/lib/sampleMerge'
import { ROUTE_TRACK_POINTS, trackToRoute, useCourseRouteStore } from '@/stores/courseRoute'

vi.mock('@/api/flights')

// a straight 1 km leg north with 1 m of GPS jitter, then a leg east: two legs, one corner
const M = 1 / 111_260
function track(): { lat: (number | null)[]; lon: (number | null)[] } {
  const lat: (number | null)[] = []
  const lon: (number | null)[] = []
  for (let i = 0; i <= 100; i++) {
    lat.push(52.87 + i * 10 * M)
    lon.push(-0.05 + (i % 2) * 1.5e-5)
  }
  for (let i = 1; i <= 100; i++) {
    lat.push(52.87 + 1000 * M)
    lon.push(-0.05 + i * 1.48e-4)
  }
  return { lat, lon }
}

describe('trackToRoute', () => {
  it('simplifies a jittery two-leg track to its start, corner and end, rounded to 6 decimals', () => {
    const t = track()
    const route = trackToRoute(t)!
    expect(route).toHaveLength(3)
    expect(route[0]).toEqual([-0.05, 52.87])
    expect(route[1]![1]).toBeCloseTo(t.lat[100]!, 6)
    expect(route[2]![0]).toBeCloseTo(-0.05 + 100 * 1.48e-4, 6)
  })

  it('skips fixes without a position and gives null when fewer than two remain', () => {
    expect(trackToRoute({ lat: [null, 52.87, 52.88], lon: [0, null, 0.01] })).toBeNull()
    expect(trackToRoute({ lat: [null, 52.87, 52.88], lon: [0, 0.01, 0.01] })).toEqual([[0.01, 52.87], [0.01, 52.88]])
  })
})

describe('useCourseRouteStore', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it('lists only the course’s ready flights', async () => {
    vi.mocked(flightsApi.listFlights).mockResolvedValue({
      items: [
        { id: 1, status: 'ready', name: 'a' },
        { id: 2, status: 'failed', name: 'b' },
        { id: 3, status: 'analysing', name: 'c' },
      ],
      total: 3,
    } as never)
    const store = useCourseRouteStore()
    await store.fetchFlights(4)
    expect(flightsApi.listFlights).toHaveBeenCalledWith(expect.objectContaining({ courseId: 4 }))
    expect(store.flights.map((f) => f.id)).toEqual([1])
    expect(store.loadingFlights).toBe(false)
  })

  it('builds the route from the flight’s whole decimated track', async () => {
    vi.mocked(flightsApi.getSamples).mockResolvedValue({ ...emptySamples(), ...track() } as never)
    const store = useCourseRouteStore()
    const route = await store.routeFromFlight(9)
    expect(flightsApi.getSamples).toHaveBeenCalledWith(9, 0, undefined, ROUTE_TRACK_POINTS)
    expect(route).toHaveLength(3)
    expect(store.building).toBe(false)
  })
})
