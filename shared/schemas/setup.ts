import { z } from 'zod'
import { SETUP_SORT_KEYS } from '../types/setup.js'

const gainSchema = z.number().min(-20, 'Gain must be ≥ −20 dBi').max(40, 'Gain must be ≤ 40 dBi')

export const txAntennaSchema = z.object({
  type: z.string().trim().min(1, 'Name the antenna type').max(80),
  gainDbi: gainSchema,
})

/** One receive antenna; a directional one needs its pointing (azimuth and elevation). */
export const rxAntennaInputSchema = z
  .object({
    label: z.string().trim().max(40).default(''),
    type: z.string().trim().min(1, 'Name the antenna type').max(80),
    kind: z.enum(['omni', 'directional']),
    gainDbi: gainSchema,
    beamwidthDeg: z.number().gt(0, 'Beamwidth must be > 0°').max(360).nullable().default(null),
    azimuthDeg: z.number().min(0).lt(360, 'Azimuth must be < 360°').nullable().default(null),
    elevationDeg: z.number().min(-90).max(90).nullable().default(null),
    polarisation: z.enum(['vertical', 'horizontal', 'rhcp', 'lhcp', 'linear-other']).default('vertical'),
  })
  .superRefine((a, ctx) => {
    if (a.kind !== 'directional') return
    if (a.azimuthDeg === null) ctx.addIssue({ code: 'custom', path: ['azimuthDeg'], message: 'Point a directional antenna: enter its azimuth' })
    if (a.elevationDeg === null) ctx.addIssue({ code: 'custom', path: ['elevationDeg'], message: 'Enter the elevation of a directional antenna' })
  })
export type RxAntennaInput = z.infer<typeof rxAntennaInputSchema>

/** Body of POST /api/setups and PUT /api/setups/:id. Power is stored in dBm; the client converts mW. */
export const setupInputSchema = z.object({
  name: z.string().trim().min(1, 'Enter a name').max(120),
  band: z.string().trim().min(1, 'Choose a band').max(40),
  freqMHz: z.number().gt(0, 'Frequency must be > 0 MHz').max(100_000),
  channel: z.string().trim().max(40).nullable().default(null),
  txPowerDbm: z.number().min(-30, 'Power must be ≥ −30 dBm').max(50, 'Power must be ≤ 50 dBm (100 W)'),
  txAntenna: txAntennaSchema,
  rxAntennas: z.array(rxAntennaInputSchema).min(1, 'Add a receive antenna').max(2, 'At most two receive antennas (diversity)'),
  cableLossDb: z.number().min(0, 'Losses must be ≥ 0 dB').max(60).default(0),
  sensitivityDbm: z.number().min(-160).max(0),
  floorDbm: z.number().min(-200).max(0).nullable().default(null),
  notes: z.string().max(5000).default(''),
})
export type SetupInput = z.infer<typeof setupInputSchema>

export const setupListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  sort: z.enum(SETUP_SORT_KEYS).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
})
export type SetupListQuery = z.infer<typeof setupListQuerySchema>
