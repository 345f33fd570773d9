import { describe, expect, it } from 'vitest'
import { formatDistance, formatHeight, formatPower } from '../../../../shared/units/format.js'

describe('formatDistance', () => {
  it('shows whole metres below 1 km', () => expect(formatDistance(850.4, 'metric')).toBe('850 m'))
  it('shows kilometres from 1 km', () => expect(formatDistance(1250, 'metric')).toBe('1.25 km'))
  it('shows feet below a tenth of a mile', () => expect(formatDistance(100, 'imperial')).toBe('328 ft'))
  it('shows miles from a tenth of a mile', () => expect(formatDistance(1609.344, 'imperial', 1)).toBe('1.0 mi'))
  it('rejects an unknown unit system', () =>
    expect(() => formatDistance(1, 'nautical' as unknown as 'metric')).toThrow(TypeError))
  it('rejects NaN naming distanceM', () => expect(() => formatDistance(NaN, 'metric')).toThrow(/distanceM/))
})

describe('formatHeight', () => {
  it('rounds to whole metres', () => expect(formatHeight(119.6, 'metric')).toBe('120 m'))
  it('converts to feet', () => expect(formatHeight(120, 'imperial')).toBe('394 ft'))
})

describe('formatPower', () => {
  it('shows dBm with milliwatts', () => expect(formatPower(20)).toBe('20.0 dBm (100 mW)'))
  it('switches to watts from 1 W', () => expect(formatPower(30)).toBe('30.0 dBm (1.00 W)'))
  it('keeps two significant digits below 1 mW', () => expect(formatPower(-10)).toBe('-10.0 dBm (0.10 mW)'))
})
