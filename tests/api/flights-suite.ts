// The set-up every flight API suite shares: one app with the import workers running, and before each test
// a clean database holding a signed-in pilot with one course and one link setup.
import { afterAll, beforeAll, beforeEach } from 'vitest'
import type { Express } from 'express'
import { createApp } from '../../server/app.js'
import { closeDb } from '../../server/db.js'
import { flightJobsService } from '../../server/services/flights/jobs.js'
import { resetDb, signedIn, type SignedIn } from './helpers.js'
import { makeCourse, makeSetup } from './fixtures-db.js'

export interface FlightSuite {
  app: Express
  /** A pilot of a fresh team. */
  s: SignedIn
  courseId: number
  setupId: number
}

/**
 * Registers the shared hooks; `onEach` gets the fresh state before each test (after the reset),
 * so a suite can keep it in its own variables and add its own preparation.
 */
export function useFlightSuite(onEach: (suite: FlightSuite) => void | Promise<void>): void {
  let app: Express
  beforeAll(async () => {
    app = createApp()
    await flightJobsService.start()
  })
  afterAll(async () => {
    await flightJobsService.stop()
    await closeDb()
  })
  beforeEach(async () => {
    await resetDb()
    const s = await signedIn(app, { role: 'pilot' })
    const courseId = (await makeCourse(s.team.id, s.user.id)).id
    const setupId = (await makeSetup(s.team.id, s.user.id)).id
    await onEach({ app, s, courseId, setupId })
  })
}
