import { z } from 'zod'
import { COURSE_SORT_KEYS } from '../types/course.js'

/** [lon, lat] in degrees, inside the valid ranges. */
export const lonLatSchema = z.tuple([
  z.number().min(-180, 'Longitude must be ≥ −180').max(180, 'Longitude must be ≤ 180'),
  z.number().min(-90, 'Latitude must be ≥ −90').max(90, 'Latitude must be ≤ 90'),
])

const obstacleFields = {
  id: z.string().trim().min(1).max(64),
  label: z.string().trim().min(1, 'Give the obstacle a label').max(120),
  heightM: z.number().min(0, 'Height must be ≥ 0 m').max(2000, 'Height must be ≤ 2000 m'),
}

/** One obstacle: a point, a line (≥ 2 points) or a polygon ring (≥ 3 points). */
export const obstacleSchema = z.discriminatedUnion('kind', [
  z.object({ ...obstacleFields, kind: z.literal('point'), coordinates: lonLatSchema }),
  z.object({
    ...obstacleFields,
    kind: z.literal('line'),
    coordinates: z.array(lonLatSchema).min(2, 'A line needs at least 2 points').max(1000),
  }),
  z.object({
    ...obstacleFields,
    kind: z.literal('polygon'),
    coordinates: z.array(lonLatSchema).min(3, 'A polygon needs at least 3 points').max(1000),
  }),
])

export const routeSchema = z.object({
  type: z.literal('LineString'),
  coordinates: z.array(lonLatSchema).min(2, 'A route needs at least 2 points').max(5000),
})

/** Body of POST /api/courses and PUT /api/courses/:id (the full course; the client sends all fields). */
export const courseInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter a name').max(120),
    notes: z.string().max(5000).default(''),
    stationLat: z.number().min(-90).max(90),
    stationLon: z.number().min(-180).max(180),
    antennaHeightM: z.number().min(0).max(1000).default(2),
    groundElevM: z.number().min(-500).max(9000).default(0),
    route: routeSchema.nullable().default(null),
    obstacles: z.array(obstacleSchema).max(500).default([]),
  })
  .superRefine((c, ctx) => {
    const seen = new Set<string>()
    c.obstacles.forEach((o, i) => {
      if (seen.has(o.id)) ctx.addIssue({ code: 'custom', path: ['obstacles', i, 'id'], message: 'Duplicate obstacle id' })
      seen.add(o.id)
    })
  })
export type CourseInput = z.infer<typeof courseInputSchema>

/** Query of GET /api/courses: search text, a whitelisted sort, and paging (limit clamped). */
export const courseListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  sort: z.enum(COURSE_SORT_KEYS).default('updatedAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
})
export type CourseListQuery = z.infer<typeof courseListQuerySchema>

/** Query of GET /api/courses/:courseId/terrain/profile: the two ends in degrees and the number of samples. */
export const terrainProfileQuerySchema = z.object({
  fromLat: z.coerce.number().min(-90).max(90),
  fromLon: z.coerce.number().min(-180).max(180),
  toLat: z.coerce.number().min(-90).max(90),
  toLon: z.coerce.number().min(-180).max(180),
  n: z.coerce.number().int().min(2, 'n must be at least 2').max(512, 'n must be at most 512').optional().default(128),
})
export type TerrainProfileQuery = z.infer<typeof terrainProfileQuerySchema>
