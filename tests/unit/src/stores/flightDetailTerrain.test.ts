import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import * as flightsApi from '@/api/flights'
import * as coursesApi from '@/api/courses'
import { TERRAIN_PROFILE_DEBOUNCE_MS, TERRAIN_PROFILE_POINTS, useFlightDetailStore } from '@/stores/flightDetail'
import { emptySamples } from '@/lib/sampleMerge'

vi.mock('@/api/flights')
vi.mock('@/api/courses')
vi.mock('@/api/setups', () => ({ getSetup: vi.fn(async (id: number) => ({ id, sensitivityDbm: -100 })) }))

const flight = { id: 7, courseId: 3, setupId: 4, analysis: { summary: { durationMs: 10_000 }, dropouts: [] } }
const course = { id: 3, stationLat: 52.87, stationLon: -0.06, groundElevM: 12, hasTerrain: true, obstacles: [] }
const profile = { distanceM: [0, 500, 1000], elevationM: [12, 20, 14] }

async function loaded(hasTerrain = true) {
  vi.mocked(coursesApi.getCourse).mockResolvedValue({ ...course, hasTerrain } as never)
  const store = useFlightDetailStore()
  await store.load(7, 1000)
  return store
}

describe('flight screen terrain profiles', () => {
  beforeEach(() => {
    setActivePinia(createPinia())
    vi.useFakeTimers()
    vi.mocked(flightsApi.getFlight).mockResolvedValue(flight as never)
    vi.mocked(flightsApi.getSamples).mockResolvedValue({ ...emptySamples(), tMs: [0, 10_000] })
    vi.mocked(coursesApi.getTerrainProfile).mockReset()
    vi.mocked(coursesApi.getTerrainProfile).mockResolvedValue(profile)
  })
  afterEach(() => vi.useRealTimers())

  it('asks once the cursor rests, for the path from the station to the aircraft, and keeps it per moment', async () => {
    const store = await loaded()
    store.requestTerrainProfile(52.871, -0.05)
    store.requestTerrainProfile(52.872, -0.049)
    expect(coursesApi.getTerrainProfile).not.toHaveBeenCalled()
    await vi.advanceTimersByTimeAsync(TERRAIN_PROFILE_DEBOUNCE_MS)
    // the cursor moved on before the pause: only the last moment is asked for
    expect(coursesApi.getTerrainProfile).toHaveBeenCalledTimes(1)
    expect(coursesApi.getTerrainProfile).toHaveBeenCalledWith(3, { lat: 52.87, lon: -0.06 }, { lat: 52.872, lon: -0.049 }, TERRAIN_PROFILE_POINTS)
    expect(store.terrainProfileAt(52.872, -0.049)).toEqual(profile)
    expect(store.terrainProfileAt(52.871, -0.05)).toBeNull()
    // the same moment again is served from the cache
    store.requestTerrainProfile(52.872, -0.049)
    await vi.advanceTimersByTimeAsync(TERRAIN_PROFILE_DEBOUNCE_MS)
    expect(coursesApi.getTerrainProfile).toHaveBeenCalledTimes(1)
  })

  it('asks for nothing when the course has no terrain', async () => {
    const store = await loaded(false)
    store.requestTerrainProfile(52.871, -0.05)
    await vi.advanceTimersByTimeAsync(TERRAIN_PROFILE_DEBOUNCE_MS * 2)
    expect(coursesApi.getTerrainProfile).not.toHaveBeenCalled()
  })

  it('remembers why a profile could not be had, so the chart can say the ground is drawn flat', async () => {
    vi.mocked(coursesApi.getTerrainProfile).mockRejectedValueOnce(new Error('This course has no terrain'))
    const store = await loaded()
    store.requestTerrainProfile(52.871, -0.05)
    await vi.advanceTimersByTimeAsync(TERRAIN_PROFILE_DEBOUNCE_MS)
    expect(store.terrainError).toBe('This course has no terrain')
    expect(store.terrainProfileAt(52.871, -0.05)).toBeNull()
  })
})
