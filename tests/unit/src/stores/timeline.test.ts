import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { useTimelineStore } from '@/stores/timeline'

describe('useTimelineStore', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it('starts at the flight start, stopped, after reset', () => {
    const t = useTimelineStore()
    t.reset(0, 60_000)
    expect([t.currentMs, t.playing, t.durationMs, t.fraction]).toEqual([0, false, 60_000, 0])
  })
  it('clamps seeks into the flight', () => {
    const t = useTimelineStore()
    t.reset(1000, 5000)
    t.seek(99_999)
    expect(t.currentMs).toBe(5000)
    t.seek(-5)
    expect(t.currentMs).toBe(1000)
  })
  it('ignores a non-finite seek', () => {
    const t = useTimelineStore()
    t.reset(0, 5000)
    t.seek(2000)
    t.seek(Number.NaN)
    expect(t.currentMs).toBe(2000)
  })
  it('advances by elapsed time times speed while playing', () => {
    const t = useTimelineStore()
    t.reset(0, 600_000)
    t.setSpeed(10)
    t.play()
    t.tick(500)
    expect(t.currentMs).toBe(5000)
  })
  it('does not move while paused', () => {
    const t = useTimelineStore()
    t.reset(0, 600_000)
    t.tick(500)
    expect(t.currentMs).toBe(0)
  })
  it('stops at the end of the flight', () => {
    const t = useTimelineStore()
    t.reset(0, 10_000)
    t.setSpeed(60)
    t.play()
    t.tick(1000)
    expect([t.currentMs, t.playing, t.atEnd]).toEqual([10_000, false, true])
  })
  it('starts over when play is pressed at the end', () => {
    const t = useTimelineStore()
    t.reset(0, 10_000)
    t.seek(10_000)
    t.play()
    expect([t.currentMs, t.playing]).toEqual([0, true])
  })
  it('toggles between playing and paused', () => {
    const t = useTimelineStore()
    t.reset(0, 10_000)
    t.toggle()
    expect(t.playing).toBe(true)
    t.toggle()
    expect(t.playing).toBe(false)
  })
  it('refuses to play a flight with no duration', () => {
    const t = useTimelineStore()
    t.reset(0, 0)
    t.play()
    expect(t.playing).toBe(false)
  })
  it('rejects a speed of zero and a reversed span', () => {
    const t = useTimelineStore()
    expect(() => t.setSpeed(0)).toThrow(/speed/)
    expect(() => t.reset(10, 0)).toThrow(/toMs/)
  })
})
