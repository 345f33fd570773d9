import { describe, expect, it } from 'vitest'
import { columnMappingSchema } from '@shared/import/mapping'
import { logKind, previewFromText, proposeMapping } from '@/lib/logPreview'

const SEMI = '\uFEFFtime_ms;lat;lon;alt_ft;rssi_dbm;lq\r\n0;52,10000;-1,30000;3,0;-45,5;100\r\n200;52,10010;-1,30010;10,5;-47,0;100\r\n400;52,1002'

describe('logKind', () => {
  it('accepts csv, tsv and txt, gzipped or not', () => {
    expect(logKind('flight.CSV')).toBe('delimited')
    expect(logKind('flight.tsv.gz')).toBe('delimited')
    expect(logKind('track.gpx')).toBe('gpx')
  })
  it('refuses other files', () => expect(logKind('photo.jpg')).toBe('unsupported'))
})

describe('previewFromText', () => {
  const p = previewFromText(SEMI, false)
  it('detects the BOM, CRLF, semicolon and decimal comma', () =>
    expect(p.layout).toEqual({ hasBom: true, lineEnding: 'crlf', delimiter: ';', decimalComma: true }))
  it('drops the cut-off last line and keeps whole rows', () => {
    expect(p.header).toEqual(['time_ms', 'lat', 'lon', 'alt_ft', 'rssi_dbm', 'lq'])
    expect(p.rows).toHaveLength(2)
    expect(p.rows[1]![4]).toBe('-47,0')
  })
  it('keeps the last line when the text is the whole file', () =>
    expect(previewFromText('t,lat\n0,1\n1,2', true).rows).toHaveLength(2))
})

describe('proposeMapping', () => {
  it('proposes roles and units that pass the shared mapping schema', () => {
    const m = proposeMapping(previewFromText(SEMI, false))
    expect(m.columns.map((c) => c.role)).toEqual(['time', 'lat', 'lon', 'alt', 'rssi1', 'lq'])
    expect(m.altUnit).toBe('ft')
    expect(m.decimalComma).toBe(true)
    expect(columnMappingSchema.safeParse(m).success).toBe(true)
  })
})

describe('assignRole', async () => {
  const { assignRole } = await import('@/lib/logPreview')
  const m = proposeMapping(previewFromText(SEMI, false))
  it('moves a single role off its previous column', () => {
    const next = assignRole(m, 5, 'rssi1')
    expect(next.columns[5]!.role).toBe('rssi1')
    expect(next.columns[4]!.role).toBe('extra')
  })
  it('lets several columns be kept as extras', () => {
    const next = assignRole(assignRole(m, 5, 'extra'), 3, 'extra')
    expect(next.columns.filter((c) => c.role === 'extra')).toHaveLength(2)
  })
  it('switches the time format when a date column is chosen', () => expect(assignRole(m, 3, 'date').timeFormat).toBe('date+time'))
})

describe('friendlyMappingMessage', async () => {
  const { friendlyMappingMessage } = await import('@/lib/logPreview')
  it('names roles as the form does', () => {
    expect(friendlyMappingMessage('Choose one rssi1 column')).toBe('Choose one "Signal, antenna 1" column')
    expect(friendlyMappingMessage('Only one column may be lat')).toBe('Only one column may be "Latitude"')
  })
})
