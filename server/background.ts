import { config } from './config.js'
import { startMailSink, stopMailSink } from './services/mailSink.js'
import { flightJobsService } from './services/flights/jobs.js'

/**
 * Long-lived services started beside the HTTP server (mail sink, job workers), in order;
 * stopped in reverse. Each feature adds its pair to SERVICES.
 */
export interface BackgroundService {
  name: string
  start: () => Promise<void>
  stop: () => Promise<void>
}

const SERVICES: BackgroundService[] = [
  {
    name: 'mail sink',
    start: async () => {
      if (!config().smtpUrl) await startMailSink()
    },
    stop: stopMailSink,
  },
  flightJobsService,
]

export async function startBackground(): Promise<void> {
  for (const s of SERVICES) await s.start()
}

export async function stopBackground(): Promise<void> {
  for (const s of [...SERVICES].reverse()) await s.stop().catch(() => undefined)
}
