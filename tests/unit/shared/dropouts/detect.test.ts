import { describe, expect, it } from 'vitest'
import { detectDropouts, gapThresholdMs, signalDropoutTotals, typicalStepMs } from '../../../../shared/dropouts/detect.js'

/** 10 Hz time base. */
const times = (n: number) => Float64Array.from({ length: n }, (_, i) => i * 100)
const opts = { sensitivityDbm: -100, floorDbm: -130, mergeWithinMs: 0 }

describe('detectDropouts', () => {
  it('finds a run of samples below sensitivity, ending when the link is back', () => {
    const rx = new Float64Array(20).fill(-80)
    rx.fill(-105, 5, 9)
    const { events, inDropout } = detectDropouts(times(20), rx, undefined, opts)
    expect(events).toHaveLength(1)
    expect(events[0]).toMatchObject({ startIndex: 5, endIndex: 8, startMs: 500, endMs: 900, durationMs: 400, fromSignal: true })
    expect([...inDropout.slice(4, 10)]).toEqual([0, 1, 1, 1, 1, 0])
  })
  it('treats the floor value as lost even above sensitivity', () => {
    const rx = new Float64Array(10).fill(-80)
    rx[3] = -130
    expect(detectDropouts(times(10), rx, undefined, { ...opts, sensitivityDbm: -140 }).events).toHaveLength(1)
  })
  it('does not count a missing (NaN) value as a loss by itself', () => {
    const rx = new Float64Array(10).fill(-80)
    rx[4] = NaN
    expect(detectDropouts(times(10), rx, undefined, opts).events).toHaveLength(0)
  })
  it('flags link quality below the threshold', () => {
    const rx = new Float64Array(10).fill(-80)
    const lq = new Float64Array(10).fill(100)
    lq[6] = 20
    const ev = detectDropouts(times(10), rx, lq, { ...opts, minLinkQualityPct: 50 }).events
    expect(ev).toHaveLength(1)
    expect(ev[0]).toMatchObject({ fromLinkQuality: true, fromSignal: false })
  })
  it('reports a telemetry gap between the frames around it', () => {
    const t = times(10)
    for (let i = 5; i < 10; i++) t[i]! += 3000
    const ev = detectDropouts(t, new Float64Array(10).fill(-70), undefined, { ...opts, maxGapMs: 1000 }).events
    expect(ev).toHaveLength(1)
    expect(ev[0]).toMatchObject({ startIndex: 4, endIndex: 5, fromGap: true, durationMs: 3100 })
  })
  it('derives the gap threshold from the typical frame interval: max(1 s, 5 × median step)', () => {
    const t50 = Float64Array.from({ length: 1000 }, (_, i) => i * 20)
    expect(typicalStepMs(t50)).toBe(20)
    expect(gapThresholdMs(t50)).toBe(1000)
    const t1 = Float64Array.from({ length: 100 }, (_, i) => i * 1000)
    expect(gapThresholdMs(t1)).toBe(5000)
    expect(gapThresholdMs(t1, { gapStepFactor: 2 })).toBe(2000)
    expect(gapThresholdMs(t50, { minGapMs: 300 })).toBe(300)
    expect(gapThresholdMs(t1, { maxGapMs: 1500 })).toBe(1500)
    expect(() => gapThresholdMs(t1, { gapStepFactor: 0 })).toThrow(/gapStepFactor/)
  })
  it('finds a 1.5 s hole in a 50 Hz log without being told the threshold', () => {
    const t = Float64Array.from({ length: 500 }, (_, i) => i * 20 + (i >= 300 ? 1480 : 0))
    const ev = detectDropouts(t, new Float64Array(500).fill(-70), undefined, opts).events
    expect(ev).toHaveLength(1)
    expect(ev[0]).toMatchObject({ startIndex: 299, endIndex: 300, fromGap: true, durationMs: 1500 })
  })
  it('does not call every frame of a jittery 1 Hz log a gap, but still finds a 6 s hole', () => {
    const t = Float64Array.from({ length: 60 }, (_, i) => i * 1000 + (i % 3) * 90 + (i >= 40 ? 5000 : 0))
    const res = detectDropouts(t, new Float64Array(60).fill(-70), undefined, opts)
    // steps run 1090, 1090, 820 ms: the median is 1090
    expect(res.gapThresholdMs).toBe(5450)
    expect(res.events.map((e) => [e.startIndex, e.endIndex, e.fromGap])).toEqual([[39, 40, true]])
  })
  it('merges events closer than mergeWithinMs', () => {
    const rx = new Float64Array(40).fill(-80)
    rx[5] = -110
    rx[8] = -110
    rx[30] = -110
    const ev = detectDropouts(times(40), rx, undefined, { ...opts, mergeWithinMs: 500 }).events
    expect(ev.map((e) => [e.startIndex, e.endIndex])).toEqual([[5, 8], [30, 30]])
  })
  it('drops events shorter than minDurationMs', () => {
    const rx = new Float64Array(20).fill(-80)
    rx[2] = -110
    rx.fill(-110, 10, 15)
    const ev = detectDropouts(times(20), rx, undefined, { ...opts, minDurationMs: 300 }).events
    expect(ev.map((e) => e.startIndex)).toEqual([10])
  })
  it('closes an event still open at the end of the log at the last sample', () => {
    const rx = new Float64Array(10).fill(-80)
    rx.fill(-110, 7)
    expect(detectDropouts(times(10), rx, undefined, opts).events[0]).toMatchObject({ endIndex: 9, endMs: 900 })
  })
  it('rejects time going backwards', () => {
    const t = times(5)
    t[3] = 0
    expect(() => detectDropouts(t, new Float64Array(5), undefined, opts)).toThrow(/timeMs/)
  })
  it('rejects a NaN time', () => {
    const t = times(5)
    t[2] = NaN
    expect(() => detectDropouts(t, new Float64Array(5), undefined, opts)).toThrow(/timeMs\[2\]/)
  })
  it('rejects a link-quality threshold above 100 %', () =>
    expect(() => detectDropouts(times(2), new Float64Array(2), undefined, { ...opts, minLinkQualityPct: 120 })).toThrow(/minLinkQualityPct/))
})

describe('signalDropoutTotals', () => {
  it('counts the same signal-only events and time as detectDropouts on random logs', () => {
    let s = 99
    const u = () => (s = (s * 16807) % 2147483647) / 2147483647
    for (let trial = 0; trial < 50; trial++) {
      const n = 500
      const t = new Float64Array(n)
      const rx = new Float64Array(n)
      for (let i = 1; i < n; i++) t[i] = t[i - 1]! + (u() < 0.05 ? 0 : 50 + Math.floor(u() * 200))
      for (let i = 0; i < n; i++) rx[i] = u() < 0.15 ? -120 : u() < 0.05 ? NaN : -80
      const o = { sensitivityDbm: -100, floorDbm: -130, mergeWithinMs: Math.floor(u() * 800), minDurationMs: Math.floor(u() * 400) }
      const events = detectDropouts(t, rx, undefined, { ...o, maxGapMs: Number.MAX_VALUE }).events
      const totals = signalDropoutTotals(t, rx, o)
      expect(totals.count).toBe(events.length)
      expect(totals.totalMs).toBe(events.reduce((a, e) => a + e.durationMs, 0))
    }
  })
})
