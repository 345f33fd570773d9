/** A dropout as the map draws it. */
export interface MapDropout {
  index: number
  lat: number
  lon: number
  cause: string
  /** Plain text for the hover (set with textContent, never as HTML). */
  text: string
}

/** A dropout band on the time axis. */
export interface TimeBand {
  index: number
  startMs: number
  endMs: number
  cause: string
}

/** One row of the dropouts table. */
export interface DropoutRow {
  index: number
  startMs: number
  durationMs: number
  distanceM: number
  heightM: number
  cause: string
  evidence: string
}
