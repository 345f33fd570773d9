import { beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { sequelize } from '../../server/db.js'
import { seedDemoCoursesAndSetups } from '../../server/scripts/seed/courses.js'
import { getCourse } from '../../server/services/courses.js'
import { listSetups } from '../../server/services/setups.js'
import { courseInputSchema } from '../../shared/schemas/course.js'
import { DEMO_COURSE } from '../../server/scripts/seed/courses.js'
import { createUser, resetDb } from './helpers.js'

beforeAll(() => void sequelize())
beforeEach(resetDb)

describe('seedDemoCoursesAndSetups', () => {
  it('creates the demo course with a tree line and a hangar, and five setups on two bands', async () => {
    const user = await createUser({ role: 'pilot' })
    const ids = await seedDemoCoursesAndSetups(user.teamId, user.id)
    const course = await getCourse(user.teamId, ids.courseId)
    expect(course.name).toBe('Heron Moor strip')
    expect(course.obstacles.map((o) => o.label)).toEqual(['Tree line (poplars)', 'Club hangar'])
    const setups = await listSetups(user.teamId, { sort: 'createdAt', order: 'asc', limit: 50, offset: 0 })
    expect(setups.items.map((s) => s.id)).toEqual(Object.values(ids.setupIds))
    expect(new Set(setups.items.map((s) => s.band))).toEqual(new Set(['868 MHz', '2.4 GHz']))
    const [low, high] = setups.items
    // ten times the power: +10 dB
    expect(high!.txPowerDbm - low!.txPowerDbm).toBeCloseTo(10, 9)
    const diversity = setups.items.find((s) => s.rxAntennas.length === 2)!
    expect(diversity.rxAntennas.map((a) => a.kind)).toEqual(['omni', 'directional'])
    expect(diversity.rxAntennas[1]).toMatchObject({ azimuthDeg: 60, beamwidthEstimated: true })
  })

  it('uses a course that passes the API’s own validation', () => {
    expect(courseInputSchema.safeParse(DEMO_COURSE).success).toBe(true)
  })
})
