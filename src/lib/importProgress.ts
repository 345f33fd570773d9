import type { FlightStatusDto } from '@/api/flights'

/** Where an upload stands as one bar: percent 0–100, a label in plain words and the bar's state. */
export interface ProgressView {
  percent: number
  label: string
  state: 'active' | 'success' | 'exception'
}

// the bar gives each stage a share: sending the file, reading/storing rows, analysing
const SEND_SHARE = 30
const IMPORT_SHARE = 60

/**
 * One progress bar across the whole journey from "send" to "ready".
 * @param sentFraction share of the file the browser has sent, 0–1
 * @param status the server's last status answer, or null while the file is still on its way
 */
export function importProgress(sentFraction: number, status: FlightStatusDto | null): ProgressView {
  const sent = Math.min(1, Math.max(0, sentFraction))
  if (!status) {
    return { percent: Math.round(sent * SEND_SHARE), label: `Sending the file… ${Math.round(sent * 100)} %`, state: 'active' }
  }
  const p = status.progress
  switch (status.status) {
    case 'queued':
      return { percent: SEND_SHARE, label: 'Waiting for a worker…', state: 'active' }
    case 'importing': {
      const f = p && p.bytesTotal > 0 ? Math.min(1, p.bytesDone / p.bytesTotal) : 0
      const rows = p ? p.rowsDone.toLocaleString('en-GB') : '0'
      return { percent: Math.round(SEND_SHARE + f * IMPORT_SHARE), label: `Reading and storing rows… ${rows} so far`, state: 'active' }
    }
    case 'analysing':
      return { percent: SEND_SHARE + IMPORT_SHARE + 5, label: 'Analysing the flight: fit, dropouts, Fresnel clearance…', state: 'active' }
    case 'ready':
      return {
        percent: 100,
        label: p && p.rowsDone > 0 ? `Ready: ${p.rowsDone.toLocaleString('en-GB')} rows stored and analysed` : 'Ready',
        state: 'success',
      }
    case 'failed':
      return { percent: 100, label: status.failure?.message ?? 'The import failed.', state: 'exception' }
  }
}
