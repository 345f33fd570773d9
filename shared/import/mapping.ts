import { z } from 'zod'

/** What a log column means to Ellipsoid. `date` pairs with a time-of-day column when time is 'date+time'. */
export const COLUMN_ROLES = [
  'time',
  'date',
  'lat',
  'lon',
  'alt',
  'rssi1',
  'rssi2',
  'lq',
  'snr',
  'extra',
  'ignore',
] as const
export type ColumnRole = (typeof COLUMN_ROLES)[number]

/** How the time column is written. */
export const TIME_FORMATS = ['ms-from-start', 's-from-start', 'iso', 'unix-s', 'unix-ms', 'date+time'] as const
export type TimeFormat = (typeof TIME_FORMATS)[number]

export const DELIMITERS = [',', ';', '\t', '|'] as const
export type Delimiter = (typeof DELIMITERS)[number]

/** Roles a column may hold at most once. */
export const SINGLE_ROLES: readonly ColumnRole[] = ['time', 'date', 'lat', 'lon', 'alt', 'rssi1', 'rssi2', 'lq', 'snr']

const columnSchema = z.object({
  /** Zero-based position in the header row. */
  index: z.number().int().min(0).max(999),
  /** Header text as written in the file (trimmed, BOM removed). */
  name: z.string().max(200),
  role: z.enum(COLUMN_ROLES),
})

/** Linear map from a 0–100 % signal scale to dBm. */
export const percentMapSchema = z
  .object({ pct0Dbm: z.number().min(-200).max(50), pct100Dbm: z.number().min(-200).max(50) })
  .refine((m) => m.pct100Dbm > m.pct0Dbm, { message: 'pct100Dbm must be above pct0Dbm' })

/** A confirmed column mapping: how to read one log layout. Shared by the client preview and the server import. */
export const columnMappingSchema = z
  .object({
    delimiter: z.enum(DELIMITERS),
    decimalComma: z.boolean(),
    columns: z.array(columnSchema).min(1).max(1000),
    altUnit: z.enum(['m', 'ft']),
    altReference: z.enum(['agl', 'amsl']),
    signalUnit: z.enum(['dbm', 'percent']),
    percentMap: percentMapSchema.nullable(),
    timeFormat: z.enum(TIME_FORMATS),
  })
  .superRefine((m, ctx) => {
    const count = (r: ColumnRole) => m.columns.filter((c) => c.role === r).length
    for (const r of SINGLE_ROLES) {
      if (count(r) > 1) ctx.addIssue({ code: 'custom', path: ['columns'], message: `Only one column may be ${r}` })
    }
    for (const r of ['time', 'lat', 'lon', 'rssi1'] as const) {
      if (count(r) !== 1) ctx.addIssue({ code: 'custom', path: ['columns'], message: `Choose one ${r} column` })
    }
    if (m.timeFormat === 'date+time' && count('date') !== 1) {
      ctx.addIssue({ code: 'custom', path: ['columns'], message: 'Date and time columns need one date column' })
    }
    if (m.signalUnit === 'percent' && !m.percentMap) {
      ctx.addIssue({ code: 'custom', path: ['percentMap'], message: 'A percentage signal needs its dBm mapping' })
    }
    const idx = new Set<number>()
    for (const c of m.columns) {
      if (idx.has(c.index)) ctx.addIssue({ code: 'custom', path: ['columns'], message: `Column ${c.index} mapped twice` })
      idx.add(c.index)
    }
  })

export type ColumnMapping = z.infer<typeof columnMappingSchema>
export type MappedColumn = ColumnMapping['columns'][number]
export type PercentMap = z.infer<typeof percentMapSchema>

/** Body of POST /api/column-mappings. */
export const saveColumnMappingSchema = z.object({
  name: z.string().trim().min(1).max(120),
  headerSignature: z.string().min(1).max(200),
  mapping: columnMappingSchema,
})
export type SaveColumnMappingInput = z.infer<typeof saveColumnMappingSchema>

/** A team's saved mapping as the API returns it. */
export interface ColumnMappingDto {
  id: number
  name: string
  headerSignature: string
  mapping: ColumnMapping
  createdAt: string
}
