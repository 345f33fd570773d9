import type { FlightAnalysis } from '@shared/analysis/types'
import { predictedRangeM } from '@shared/propagation/predictions'
import { formatPower } from '@shared/units/format'
import { CAUSE_STYLES } from './dropoutCauses'
import { formatElapsed } from './series'

/** One summary card: a figure, what it is, and a plain-words explanation for the hover. */
export interface SummaryCard {
  key: string
  label: string
  value: string
  /** Smaller second line, e.g. an interval or a share. */
  detail: string
  explain: string
}

/** How the caller formats a distance (metric or imperial). */
export type DistanceFormatter = (distanceM: number) => string

/**
 * The range predicted by the flight's model where the signal falls to sensitivity plus a fade margin.
 * @returns metres, or null when there is no model
 */
export function rangeAtMarginM(analysis: FlightAnalysis, sensitivityDbm: number, fadeMarginDb: number): number | null {
  const m = analysis.model
  if (!m || !(m.exponent > 0)) return null
  return predictedRangeM(m, sensitivityDbm, Math.max(0, fadeMarginDb))
}

function fitCards(analysis: FlightAnalysis): SummaryCard[] {
  const fit = analysis.fit
  const none = analysis.fitError ?? 'Not enough usable samples for a fit.'
  return [
    {
      key: 'exponent',
      label: 'Path-loss exponent n',
      value: fit ? fit.exponent.toFixed(2) : '—',
      detail: fit ? `${Math.round(fit.confidenceLevel * 100)} % interval ${fit.exponentLower.toFixed(2)}–${fit.exponentUpper.toFixed(2)}` : none,
      explain:
        'How fast the signal fell with distance on this flight. 2 is open space; near the ground 2.5–3.5 is usual. Higher means each extra dB of power buys less range. The interval is where the true value likely lies.',
    },
    {
      key: 'sigma',
      label: 'Shadowing σ',
      value: fit ? `${fit.residualSigmaDb.toFixed(1)} dB` : '—',
      detail: fit ? `from ${fit.sampleCount} samples` : '',
      explain:
        'How far single readings scatter around the fitted curve. A large value means the signal jumped about (terrain, attitude, reflections): keep a bigger fade margin.',
    },
    {
      key: 'r2',
      label: 'Fit quality R²',
      value: fit ? fit.rSquared.toFixed(2) : '—',
      detail: fit ? 'share of the variation the distance explains' : '',
      explain:
        'How much of the change in signal is explained by distance alone. Near 1: distance was what mattered. Low: something else (obstacles, antenna pointing) dominated.',
    },
  ]
}

function dropoutDetail(analysis: FlightAnalysis): string {
  const parts = Object.entries(analysis.summary.dropoutsByCause)
    .filter(([, n]) => n > 0)
    .map(([cause, n]) => `${n} ${(CAUSE_STYLES as Record<string, { label: string }>)[cause]?.label.toLowerCase() ?? cause}`)
  return parts.length ? parts.join(', ') : 'none'
}

/**
 * The summary cards of the flight screen, in display order.
 * @param analysis the flight's stored analysis
 * @param sensitivityDbm receiver sensitivity of the setup, dBm
 * @param fadeMarginDb margin the pilot wants kept above sensitivity, dB
 * @param distance formats metres in the user's units
 */
export function summaryCards(
  analysis: FlightAnalysis,
  sensitivityDbm: number,
  fadeMarginDb: number,
  distance: DistanceFormatter,
): SummaryCard[] {
  const s = analysis.summary
  const range = rangeAtMarginM(analysis, sensitivityDbm, fadeMarginDb)
  const share = s.durationMs > 0 ? Math.round((s.timeWithLinkMs / s.durationMs) * 100) : 0
  return [
    ...fitCards(analysis),
    {
      key: 'furthest',
      label: 'Furthest with link',
      value: s.maxDistanceWithLinkM != null ? distance(s.maxDistanceWithLinkM) : '—',
      detail: analysis.distances.maxDistanceM != null ? `flown out to ${distance(analysis.distances.maxDistanceM)}` : '',
      explain: 'The greatest ground distance from the station at which the link still held on this flight.',
    },
    {
      key: 'range',
      label: `Predicted range (${fadeMarginDb} dB margin)`,
      value: range != null ? distance(range) : '—',
      detail: analysis.model.source === 'fit' ? 'from the fitted curve' : 'free-space estimate (no fit)',
      explain: `Where the ${analysis.model.source === 'fit' ? 'fitted' : 'free-space'} curve falls to the receiver's sensitivity plus ${fadeMarginDb} dB of fade margin. 10–20 dB is the usual margin for a link you can rely on. A prediction, not a promise: fly within the limits your local rules allow.`,
    },
    {
      key: 'time',
      label: 'Time with link',
      value: formatElapsed(s.timeWithLinkMs),
      detail: `${share} % of ${formatElapsed(s.durationMs)}`,
      explain: 'How long the receiver heard the aircraft, out of the whole log.',
    },
    {
      key: 'dropouts',
      label: 'Dropouts',
      value: String(s.dropoutCount),
      detail: dropoutDetail(analysis),
      explain:
        'Times the link was lost, by probable cause. Each is a marker on the map and a row in the table below; click one to see the geometry at that moment.',
    },
    {
      key: 'eirp',
      label: 'EIRP',
      value: formatPower(s.eirpDbm),
      detail: 'transmit power + antenna gain',
      explain:
        'Effective radiated power: what regulators limit. Stay within the EIRP your region and licence allow, and keep clear of transmit antennas at higher powers.',
    },
  ]
}
