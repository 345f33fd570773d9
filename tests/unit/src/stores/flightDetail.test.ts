import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import * as flightsApi from '@/api/flights'
import { useFlightDetailStore } from '@/stores/flightDetail'
import { useTimelineStore } from '@/stores/timeline'
import { emptySamples } from '@/lib/sampleMerge'

vi.mock('@/api/flights')
vi.mock('@/api/courses', () => ({ getCourse: vi.fn(async (id: number) => ({ id, obstacles: [] })) }))
vi.mock('@/api/setups', () => ({ getSetup: vi.fn(async (id: number) => ({ id, sensitivityDbm: -100 })) }))

const flight = { id: 7, courseId: 3, setupId: 4, analysis: { summary: { durationMs: 1_000_000 }, dropouts: [{ startMs: 420_000 }] } }
const overview = { ...emptySamples(), tMs: Array.from({ length: 2000 }, (_, i) => i * 500) }

describe('useFlightDetailStore', () => {
  beforeEach(() => {
    setActivePinia(createPinia())
    vi.mocked(flightsApi.getFlight).mockResolvedValue(flight as never)
    vi.mocked(flightsApi.getSamples).mockReset()
    vi.mocked(flightsApi.getSamples).mockResolvedValue(overview)
  })

  it('asks for the whole flight at two points per pixel and puts the timeline at its start', async () => {
    const store = useFlightDetailStore()
    await store.load(7, 1000)
    expect(flightsApi.getSamples).toHaveBeenCalledWith(7, 0, undefined, 2000)
    expect(store.overviewRequest).toEqual({ fromMs: 0, toMs: 1_000_000, maxPoints: 2000 })
    const t = useTimelineStore()
    expect([t.startMs, t.endMs, t.currentMs]).toEqual([0, 1_000_000, 0])
  })

  it('takes over the requests a prefetch started instead of asking again', async () => {
    vi.mocked(flightsApi.getFlight).mockClear()
    const store = useFlightDetailStore()
    store.prefetch(7, 600)
    expect(flightsApi.getFlight).toHaveBeenCalledTimes(1)
    expect(flightsApi.getSamples).toHaveBeenCalledWith(7, 0, undefined, 1200)
    await store.load(7, 1000)
    expect(flightsApi.getFlight).toHaveBeenCalledTimes(1)
    expect(flightsApi.getSamples).toHaveBeenCalledTimes(1)
    expect(store.overviewRequest).toEqual({ fromMs: 0, toMs: 1_000_000, maxPoints: 1200 })
    expect(store.course).toEqual({ id: 3, obstacles: [] })
    // a prefetch of another flight is not taken for this one
    store.prefetch(8, 600)
    await store.load(7, 1000)
    expect(flightsApi.getSamples).toHaveBeenLastCalledWith(7, 0, undefined, 2000)
  })

  it('asks for a finer padded window when a chart zooms in far, and splices it into the samples', async () => {
    const store = useFlightDetailStore()
    await store.load(7, 1000)
    vi.mocked(flightsApi.getSamples).mockResolvedValueOnce({ ...emptySamples(), tMs: [400_000, 400_010, 400_020] })
    await store.refine({ fromMs: 400_000, toMs: 500_000 }, 1000)
    expect(flightsApi.getSamples).toHaveBeenLastCalledWith(7, 375_000, 525_000, 3000)
    expect(store.samples.tMs).toContain(400_010)
    expect(store.samples.tMs[0]).toBe(0)
  })

  it('asks for nothing when the loaded samples already cover a gentle zoom', async () => {
    const store = useFlightDetailStore()
    await store.load(7, 1000)
    await store.refine({ fromMs: 0, toMs: 600_000 }, 1000)
    expect(flightsApi.getSamples).toHaveBeenCalledTimes(1)
  })

  it('drops a slow window answer that a newer request overtook', async () => {
    const store = useFlightDetailStore()
    await store.load(7, 1000)
    let releaseSlow: (v: flightsApi.SamplesDto) => void = () => undefined
    vi.mocked(flightsApi.getSamples)
      .mockReturnValueOnce(new Promise((r) => (releaseSlow = r)))
      .mockResolvedValueOnce({ ...emptySamples(), tMs: [800_000] })
    const slow = store.refine({ fromMs: 100_000, toMs: 110_000 }, 1000)
    await store.refine({ fromMs: 800_000, toMs: 810_000 }, 1000)
    releaseSlow({ ...emptySamples(), tMs: [100_123] })
    await slow
    expect(store.samples.tMs).toContain(800_000)
    expect(store.samples.tMs).not.toContain(100_123)
  })

  it('moves the timeline to a chosen dropout', async () => {
    const store = useFlightDetailStore()
    await store.load(7, 1000)
    store.selectDropout(0)
    expect([store.selectedDropout, useTimelineStore().currentMs]).toEqual([0, 420_000])
  })
})
