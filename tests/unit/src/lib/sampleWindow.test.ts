import { describe, expect, it } from 'vitest'
import {
  estimatedChartWidthPx,
  clampWindow,
  MAX_POINTS_PER_VIEW,
  MIN_POINTS_PER_VIEW,
  planSampleRequest,
  pointsForWidth,
  sampleQuery,
  timeWindowInBox,
  windowFromPercent,
} from '@/lib/sampleWindow'

const FLIGHT = { fromMs: 0, toMs: 1_000_000 }

describe('pointsForWidth', () => {
  it('asks for two points per pixel', () => expect(pointsForWidth(1200)).toBe(2400))
  it('never asks for more than the per-view cap', () => expect(pointsForWidth(5000)).toBe(MAX_POINTS_PER_VIEW))
  it('never asks for fewer than the floor', () => expect(pointsForWidth(0)).toBe(MIN_POINTS_PER_VIEW))
})

describe('estimatedChartWidthPx', () => {
  it('guesses one of two columns beside the side menu on a desktop, the full column on a tablet', () => {
    // 1440: main column 1200 - 56 padding, screen padding 40, two columns with a 12 px gap, panel padding 22
    expect(estimatedChartWidthPx(1440)).toBe(524)
    expect(estimatedChartWidthPx(800)).toBe(706)
    expect(estimatedChartWidthPx(0)).toBe(0)
  })
})

describe('windowFromPercent', () => {
  it('maps dataZoom percentages onto flight time', () =>
    expect(windowFromPercent(25, 50, FLIGHT)).toEqual({ fromMs: 250_000, toMs: 500_000 }))
})

describe('clampWindow', () => {
  it('keeps a window inside the flight', () =>
    expect(clampWindow({ fromMs: -50, toMs: 2_000_000 }, FLIGHT)).toEqual(FLIGHT))
  it('keeps a degenerate window 1 ms wide', () =>
    expect(clampWindow({ fromMs: 500, toMs: 500 }, FLIGHT)).toEqual({ fromMs: 500, toMs: 501 }))
})

describe('planSampleRequest', () => {
  it('asks for the whole flight at overview resolution first', () => {
    expect(planSampleRequest(FLIGHT, 1000, null, FLIGHT)).toEqual({ fromMs: 0, toMs: 1_000_000, maxPoints: 2000 })
  })
  it('asks for nothing when the loaded data already covers the view finely enough', () => {
    const loaded = { fromMs: 0, toMs: 1_000_000, maxPoints: 2000 }
    // half the flight: the loaded spacing (500 ms) is within 2x of the needed 250 ms
    expect(planSampleRequest({ fromMs: 0, toMs: 500_000 }, 1000, loaded, FLIGHT, 2000)).toBeNull()
  })
  it('refines when zoomed in further than twice the loaded spacing, with padding either side', () => {
    const loaded = { fromMs: 0, toMs: 1_000_000, maxPoints: 2000 }
    const req = planSampleRequest({ fromMs: 400_000, toMs: 500_000 }, 1000, loaded, FLIGHT, 2000)
    expect(req).toEqual({ fromMs: 375_000, toMs: 525_000, maxPoints: 3000 })
  })
  it('stays under the per-view cap when padding widens the window', () => {
    const req = planSampleRequest({ fromMs: 400_000, toMs: 500_000 }, 1900, null, FLIGHT)
    expect(req!.maxPoints).toBe(MAX_POINTS_PER_VIEW)
  })
  it('asks for nothing more when the server already returned every raw sample of the window', () => {
    const loaded = { fromMs: 0, toMs: 1_000_000, maxPoints: 2000 }
    expect(planSampleRequest({ fromMs: 1000, toMs: 2000 }, 1000, loaded, FLIGHT, 900)).toBeNull()
  })
  it('requests again when the view leaves the loaded window', () => {
    const loaded = { fromMs: 375_000, toMs: 525_000, maxPoints: 3000 }
    const req = planSampleRequest({ fromMs: 600_000, toMs: 700_000 }, 1000, loaded, FLIGHT, 3000)
    expect(req).toEqual({ fromMs: 575_000, toMs: 725_000, maxPoints: 3000 })
  })
})

describe('sampleQuery', () => {
  it('writes integer query parameters', () =>
    expect(sampleQuery({ fromMs: 1.4, toMs: 99.2, maxPoints: 800 })).toBe('fromMs=1&toMs=100&maxPoints=800'))
})

describe('timeWindowInBox', () => {
  const t = [0, 1000, 2000, 3000]
  const lat = [51.0, 51.1, 51.2, 51.3]
  const lon = [-1.0, -1.0, -1.0, -1.0]
  it('returns the time span of the samples inside the box', () =>
    expect(timeWindowInBox(t, lat, lon, { south: 51.05, north: 51.25, west: -2, east: 0 })).toEqual({
      fromMs: 1000,
      toMs: 2000,
    }))
  it('returns null when nothing is inside', () =>
    expect(timeWindowInBox(t, lat, lon, { south: 0, north: 1, west: 0, east: 1 })).toBeNull())
})

describe('spliceWindow', async () => {
  const { spliceWindow, emptySamples } = await import('@/lib/sampleMerge')
  const cols = (t: number[]) => ({ ...emptySamples(), tMs: t, rssi1Dbm: t.map((x) => -x) })
  it('replaces the overview inside the window with the detail samples', () => {
    const merged = spliceWindow(cols([0, 100, 200, 300, 400]), cols([150, 175, 200, 225, 250]), { fromMs: 150, toMs: 250 })
    expect(merged.tMs).toEqual([0, 100, 150, 175, 200, 225, 250, 300, 400])
    expect(merged.rssi1Dbm).toEqual([-0, -100, -150, -175, -200, -225, -250, -300, -400])
  })
  it('returns the overview when there is no detail', () => {
    const o = cols([0, 1])
    expect(spliceWindow(o, null, null)).toBe(o)
  })
})
