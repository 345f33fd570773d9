import { describe, expect, it } from 'vitest'
import { emptySamples } from '@/lib/sampleMerge'
import { colouredSegments, nearestSampleToPoint } from '@/lib/trackSegments'
import { NO_SIGNAL_COLOUR, SIGNAL_RAMP } from '@/lib/signalScale'

const s = {
  ...emptySamples(),
  tMs: [0, 100, 200, 300, 9000],
  lat: [51, 51.001, 51.002, 51.003, 51.004],
  lon: [-1, -1, -1, -1, -1],
  rssi1Dbm: [-40, -100, null, -40, -40],
  rssi2Dbm: [null, null, null, null, null],
}

describe('colouredSegments', () => {
  const bins = colouredSegments(s, { lowDbm: -100, highDbm: -40 })
  const byColour = Object.fromEntries(bins.map((b) => [b.colour, b.segments.length]))
  it('colours each segment by the signal at its start', () => {
    expect(byColour[SIGNAL_RAMP[4]!]).toBe(1)
    expect(byColour[SIGNAL_RAMP[0]!]).toBe(1)
  })
  it('paints segments without a reading grey', () => expect(byColour[NO_SIGNAL_COLOUR]).toBe(1))
  it('does not bridge a long telemetry gap', () => {
    // 4 steps between 5 samples; the 8.7 s step at the end is left open
    expect(bins.reduce((n, b) => n + b.segments.length, 0)).toBe(3)
  })
})

describe('nearestSampleToPoint', () => {
  it('finds the closest fix', () => expect(nearestSampleToPoint(s, 51.0021, -1)).toBe(2))
})
