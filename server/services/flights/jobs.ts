import { analyseAndStore } from './analyse.js'
import { recomputeDistances } from './flights.js'
import { runImport } from './importRunner.js'
import { startFlightJobs, stopFlightJobs, type AnalyseJob } from './queue.js'

async function analyse(job: AnalyseJob): Promise<void> {
  if (job.recomputeDistances) await recomputeDistances(job.flightId)
  await analyseAndStore(job.flightId)
}

/** Background service: the flight import and analysis workers of this instance. */
export const flightJobsService = {
  name: 'flight jobs',
  start: () => startFlightJobs({ runImport, analyse }),
  stop: stopFlightJobs,
}
