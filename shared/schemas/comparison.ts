import { z } from 'zod'

const idSchema = z.number().int().positive()

/** Body of POST /api/comparisons/preview. */
export const comparisonPreviewSchema = z
  .object({
    flightIds: z
      .array(idSchema)
      .min(2, 'Pick at least two flights')
      .max(6, 'Pick at most six flights')
      .refine((ids) => new Set(ids).size === ids.length, 'Each flight only once'),
    baselineId: idSchema,
    fadeMarginDb: z.number().min(0, 'Fade margin must be ≥ 0 dB').max(40, 'Fade margin must be ≤ 40 dB').default(10),
  })
  .refine((v) => v.flightIds.includes(v.baselineId), { path: ['baselineId'], message: 'The baseline must be one of the flights' })
export type ComparisonPreviewInput = z.infer<typeof comparisonPreviewSchema>

/** Body of POST /api/comparisons and PUT /api/comparisons/:id. */
export const comparisonInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter a name').max(120),
    conclusion: z.string().trim().max(4000).default(''),
    flightIds: z
      .array(idSchema)
      .min(2, 'Pick at least two flights')
      .max(6, 'Pick at most six flights')
      .refine((ids) => new Set(ids).size === ids.length, 'Each flight only once'),
    baselineId: idSchema,
    fadeMarginDb: z.number().min(0).max(40).default(10),
  })
  .refine((v) => v.flightIds.includes(v.baselineId), { path: ['baselineId'], message: 'The baseline must be one of the flights' })
export type ComparisonInput = z.infer<typeof comparisonInputSchema>
