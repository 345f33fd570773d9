import { describe, expect, it } from 'vitest'
import { guessMapping, guessTimeFormat } from '../../../../shared/import/guessRoles.js'
import { RowReport } from '../../../../shared/import/rowReport.js'

describe('guessMapping', () => {
  it('proposes roles from common header names', () => {
    const g = guessMapping(['Time (ms)', 'GPS Lat', 'GPS Lon', 'Alt (ft)', 'RSSI1 dBm', 'RSSI2', 'LQ', 'SNR', 'Sats'], [
      ['0', '51.1', '-1.2', '100', '-60', '-62', '100', '9', '12'],
      ['100', '51.1', '-1.2', '101', '-61', '-63', '100', '8', '12'],
    ], false)
    expect(g.columns.map((c) => c.role)).toEqual(['time', 'lat', 'lon', 'alt', 'rssi1', 'rssi2', 'lq', 'snr', 'extra'])
    expect(g.altUnit).toBe('ft')
    expect(g.signalUnit).toBe('dbm')
    expect(g.timeFormat).toBe('ms-from-start')
  })
  it('finds a time column by its ISO values and a percentage signal by its range', () => {
    const g = guessMapping(['stamp', 'latitude', 'longitude', 'signal'], [['2026-05-01T10:00:00Z', '51', '1', '80']], false)
    expect(g.columns[0]!.role).toBe('time')
    expect(g.timeFormat).toBe('iso')
    expect(g.signalUnit).toBe('percent')
  })
  it('pairs a date column with a time-of-day column', () => {
    const g = guessMapping(['date', 'time', 'lat', 'lon', 'rssi'], [['2026-05-01', '10:00:00.1', '51', '1', '-60']], false)
    expect(g.timeFormat).toBe('date+time')
    expect(g.columns[0]!.role).toBe('date')
  })
})

describe('guessTimeFormat', () => {
  it('tells Unix seconds, Unix ms and seconds from start apart', () => {
    expect(guessTimeFormat(['1777777777', '1777777778'], null, false)).toBe('unix-s')
    expect(guessTimeFormat(['1777777777000'], null, false)).toBe('unix-ms')
    expect(guessTimeFormat(['0.0', '0.1', '0.2'], null, false)).toBe('s-from-start')
  })
})

describe('RowReport', () => {
  it('refuses a file above the bad-row share and keeps the first rows in full', () => {
    const r = new RowReport()
    r.goodRows = 97
    for (let i = 0; i < 3; i++) r.bad(i + 2, 'lat', 'out of range')
    expect(r.refused(0.02)).toBe(true)
    expect(r.refused(0.05)).toBe(false)
    expect(r.toDto().byReason).toEqual({ 'lat: out of range': 3 })
  })
  it('refuses a file with no usable rows', () => {
    expect(new RowReport().refused(0.5)).toBe(true)
  })
})
