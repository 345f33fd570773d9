import type { DropoutCause, DropoutEvidence } from '@shared/dropouts/classify'

/** How each probable cause is named, marked and explained on the flight screen. */
export interface CauseStyle {
  label: string
  /** One letter drawn in the marker, so the cause never depends on colour alone. */
  letter: string
  colour: string
  explain: string
}

// categorical colours picked apart in hue and lightness from each other and from the signal ramp
export const CAUSE_STYLES: Readonly<Record<DropoutCause, CauseStyle>> = {
  obstruction: {
    label: 'Path blocked',
    letter: 'B',
    colour: '#c2410c',
    explain: 'Something (ground, a building, trees) stood inside the first Fresnel zone between the antennas.',
  },
  beam: {
    label: 'Off the beam',
    letter: 'A',
    colour: '#7e22ce',
    explain: 'The aircraft was outside the half-power beam of the directional ground antenna.',
  },
  range: {
    label: 'Out of range',
    letter: 'R',
    colour: '#0f172a',
    explain: 'The model predicted less than the fade margin above sensitivity at that distance.',
  },
  reflection: {
    label: 'Reflection fade',
    letter: 'F',
    colour: '#db2777',
    explain: 'A sudden fade near a distance where the ground reflection cancels the direct wave.',
  },
  gap: {
    label: 'Log gap',
    letter: 'G',
    colour: '#a16207',
    explain: 'The log has no rows for a while; the telemetry itself stopped.',
  },
  unexplained: {
    label: 'Unexplained',
    letter: '?',
    colour: '#475569',
    explain: 'None of the rules matched: look at the evidence and the charts.',
  },
}

/** Style for a cause string from the API (unknown values fall back to "unexplained"). */
export function causeStyle(cause: string): CauseStyle {
  return (CAUSE_STYLES as Record<string, CauseStyle>)[cause] ?? CAUSE_STYLES.unexplained
}

/** The evidence numbers of a dropout, as the table and the map hover show them. */
export type EvidenceFields = Omit<DropoutEvidence, 'distanceM' | 'heightM'>

/**
 * One line of plain words listing the figures behind a classification.
 * @param distance formats metres in the user's units
 */
export function evidenceText(e: EvidenceFields, distance: (m: number) => string): string {
  const parts: string[] = []
  if (e.minClearanceFraction !== null) {
    const what = e.limitingObstacle ?? 'ground'
    // below zero the straight line itself is cut: a percentage of the zone means little then
    parts.push(
      e.minClearanceFraction < 0
        ? `line of sight cut by ${what}`
        : `Fresnel clearance ${Math.round(e.minClearanceFraction * 100)} % (${what})`,
    )
  }
  if (e.maxPointingLossDb >= 1) parts.push(`${e.maxPointingLossDb.toFixed(1)} dB off the beam`)
  if (e.predictedMarginDb !== null) parts.push(`model margin ${e.predictedMarginDb.toFixed(1)} dB`)
  if (e.signalBeforeDbm !== null) parts.push(`signal before ${e.signalBeforeDbm.toFixed(0)} dBm${e.suddenFade ? ', sudden fade' : ''}`)
  if (e.nearNull && e.nearestNullM !== null) parts.push(`near a reflection null at ${distance(e.nearestNullM)}`)
  return parts.join(' · ')
}
