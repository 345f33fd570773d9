import { describe, expect, it } from 'vitest'
import type { ColumnMapping } from '../../../../shared/import/mapping.js'
import { columnMappingSchema } from '../../../../shared/import/mapping.js'
import { MappingMismatchError, RowConverter, emptySampleRow } from '../../../../shared/import/rowConverter.js'

const header = ['time_ms', 'lat', 'lon', 'alt', 'rssi', 'lq', 'note']
function mapping(over: Partial<ColumnMapping> = {}): ColumnMapping {
  return columnMappingSchema.parse({
    delimiter: ',',
    decimalComma: false,
    columns: [
      { index: 0, name: 'time_ms', role: 'time' },
      { index: 1, name: 'lat', role: 'lat' },
      { index: 2, name: 'lon', role: 'lon' },
      { index: 3, name: 'alt', role: 'alt' },
      { index: 4, name: 'rssi', role: 'rssi1' },
      { index: 5, name: 'lq', role: 'lq' },
      { index: 6, name: 'note', role: 'extra' },
    ],
    altUnit: 'm',
    altReference: 'agl',
    signalUnit: 'dbm',
    percentMap: null,
    timeFormat: 'ms-from-start',
    ...over,
  })
}

describe('RowConverter', () => {
  it('converts a good row with time relative to the first row', () => {
    const c = new RowConverter(mapping(), header, { groundElevM: 0 })
    const out = emptySampleRow()
    expect(c.convert(['500', '51.5', '-1.25', '30', '-70', '99', 'hi'], out)).toBe('ok')
    expect(c.convert(['600', '51.5', '-1.25', '31', '-71', '98', ''], out)).toBe('ok')
    expect(out).toMatchObject({ tMs: 100, lat: 51.5, lon: -1.25, altM: 31, rssi1Dbm: -71, lq: 98, extrasJson: '{"note":""}' })
    expect(out.rssi2Dbm).toBeNaN()
  })
  it('skips a leading 0,0 row as no fix, but refuses one mid-flight', () => {
    const c = new RowConverter(mapping(), header, { groundElevM: 0 })
    const out = emptySampleRow()
    expect(c.convert(['0', '0', '0', '0', '-50', '100', ''], out)).toBe('no-fix')
    expect(c.convert(['1', '51', '1', '0', '-50', '100', ''], out)).toBe('ok')
    expect(c.convert(['2', '0', '0', '0', '-50', '100', ''], out)).toEqual({ column: 'lat', reason: 'no GPS fix (0, 0)' })
  })
  it('names the column and reason for out-of-range and unreadable values', () => {
    const c = new RowConverter(mapping(), header, { groundElevM: 0 })
    const out = emptySampleRow()
    expect(c.convert(['0', '91', '1', '0', '-50', '100', ''], out)).toMatchObject({ column: 'lat' })
    expect(c.convert(['0', '51', '181', '0', '-50', '100', ''], out)).toMatchObject({ column: 'lon' })
    expect(c.convert(['0', '51', '1', '0', 'strong', '100', ''], out)).toMatchObject({ column: 'rssi' })
    expect(c.convert(['0', '51', '1', '0', '-50', '101', ''], out)).toMatchObject({ column: 'lq' })
    expect(c.convert(['x', '51', '1', '0', '-50', '100', ''], out)).toMatchObject({ column: 'time_ms' })
  })
  it('refuses time going backwards but allows equal timestamps', () => {
    const c = new RowConverter(mapping(), header, { groundElevM: 0 })
    const out = emptySampleRow()
    c.convert(['100', '51', '1', '0', '-50', '100', ''], out)
    expect(c.convert(['100', '51', '1', '0', '-50', '100', ''], out)).toBe('ok')
    expect(c.convert(['99', '51', '1', '0', '-50', '100', ''], out)).toEqual({ column: 'time_ms', reason: 'time goes backwards' })
  })
  it('converts feet above sea level to metres above ground', () => {
    const c = new RowConverter(mapping({ altUnit: 'ft', altReference: 'amsl' }), header, { groundElevM: 100 })
    const out = emptySampleRow()
    c.convert(['0', '51', '1', '1000', '-50', '100', ''], out)
    expect(out.altM).toBeCloseTo(1000 * 0.3048 - 100, 9) // 1 ft = 0.3048 m exactly (international foot)
  })
  it('maps a percentage signal linearly to dBm', () => {
    const c = new RowConverter(mapping({ signalUnit: 'percent', percentMap: { pct0Dbm: -110, pct100Dbm: -30 } }), header, {
      groundElevM: 0,
    })
    const out = emptySampleRow()
    c.convert(['0', '51', '1', '0', '25', '100', ''], out)
    expect(out.rssi1Dbm).toBeCloseTo(-90, 9) // -110 + 0.25 * 80
  })
  it('throws when a mapped column is not in the header', () => {
    expect(() => new RowConverter(mapping(), ['time_ms', 'lat'], { groundElevM: 0 })).toThrow(MappingMismatchError)
  })
  it('refuses a row with more fields than the header, but not a trailing delimiter', () => {
    const c = new RowConverter(mapping(), header, { groundElevM: 0 })
    const long = ['1', '51', '1', '0', '-50', '100', '', ...Array.from({ length: 300 }, () => '7')]
    expect(c.convert(long, emptySampleRow())).toEqual({ column: '#8', reason: 'has 307 fields, the header has 7' })
    expect(c.convert(['1', '51', '1', '0', '-50', '100', '', ''], emptySampleRow())).toBe('ok')
  })
  it('refuses a short row', () => {
    const c = new RowConverter(mapping(), header, { groundElevM: 0 })
    expect(c.convert(['1', '2'], emptySampleRow())).toMatchObject({ column: '*' })
  })
})

describe('columnMappingSchema', () => {
  it('requires one time, lat, lon and rssi1 column', () => {
    const r = columnMappingSchema.safeParse({ ...mapping(), columns: [{ index: 0, name: 'lat', role: 'lat' }] })
    expect(r.success).toBe(false)
  })
  it('requires the dBm mapping for a percentage signal', () => {
    expect(columnMappingSchema.safeParse({ ...mapping(), signalUnit: 'percent', percentMap: null }).success).toBe(false)
  })
})
