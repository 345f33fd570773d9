import { describe, expect, it } from 'vitest'
import { formatDms, parseCoordinate } from '../../../../shared/geo/dms.js'

describe('parseCoordinate', () => {
  it('reads decimal degrees with a sign or a decimal comma', () => {
    expect(parseCoordinate('52.8712', 'lat')).toBeCloseTo(52.8712, 9)
    expect(parseCoordinate('-0,0563', 'lon')).toBeCloseTo(-0.0563, 9)
  })
  it('reads degrees, minutes and seconds with marks and a trailing hemisphere', () => {
    // 51 + 28/60 + 36.5/3600 = 51.476805…
    expect(parseCoordinate(`51°28'36.5"N`, 'lat')).toBeCloseTo(51.4768056, 6)
    expect(parseCoordinate('51° 28′ 36.5″ S', 'lat')).toBeCloseTo(-51.4768056, 6)
  })
  it('reads space-separated DMS and degrees with decimal minutes, hemisphere first', () => {
    expect(parseCoordinate('0 3 22.7 W', 'lon')).toBeCloseTo(-(3 / 60 + 22.7 / 3600), 8)
    expect(parseCoordinate("W 1° 15.5'", 'lon')).toBeCloseTo(-(1 + 15.5 / 60), 8)
  })
  it('rejects a latitude hemisphere on a longitude', () => {
    expect(() => parseCoordinate('10 N', 'lon')).toThrow(/not a longitude hemisphere/)
  })
  it('rejects both a sign and a hemisphere', () => {
    expect(() => parseCoordinate('-10 S', 'lat')).toThrow(/either a sign or a hemisphere/)
  })
  it('rejects minutes of 60 or more and out-of-range values', () => {
    expect(() => parseCoordinate('10 60 0', 'lat')).toThrow(/minutes/)
    expect(() => parseCoordinate('91', 'lat')).toThrow(/±90/)
    expect(() => parseCoordinate('181 E', 'lon')).toThrow(/±180/)
  })
  it('rejects text that is not a coordinate, and fractional degrees before minutes', () => {
    expect(() => parseCoordinate('north field', 'lat')).toThrow(/not a coordinate/)
    expect(() => parseCoordinate('', 'lat')).toThrow(/enter a coordinate/)
    expect(() => parseCoordinate('10.5 30', 'lat')).toThrow(/degrees must be whole/)
  })
})

describe('formatDms', () => {
  it('formats with padded minutes and seconds and a hemisphere letter', () => {
    expect(formatDms(-0.0563, 'lon')).toBe('0°03′22.7″W')
    expect(formatDms(51.4768056, 'lat')).toBe('51°28′36.5″N')
  })
  it('round-trips through parseCoordinate within the printed precision', () => {
    const v = 52.8712
    expect(parseCoordinate(formatDms(v, 'lat', 2), 'lat')).toBeCloseTo(v, 5)
  })
})
