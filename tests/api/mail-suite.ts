// The hooks of the suites that send mail (sign-up, invites, resets): the local mail sink runs for the
// whole file, so the tests can read what was sent, and each test starts from an empty database.
import { afterAll, beforeAll, beforeEach } from 'vitest'
import { startMailSink, stopMailSink } from '../../server/services/mailSink.js'
import { resetDb } from './helpers.js'

/** Registers the mail sink's start/stop and the per-test database reset. */
export function useMailSuite(): void {
  beforeAll(async () => {
    await startMailSink()
  })
  afterAll(async () => {
    await stopMailSink()
  })
  beforeEach(resetDb)
}
