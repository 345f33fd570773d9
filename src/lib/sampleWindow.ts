/**
 * Which slice of a flight to ask the server for. Charts and the map show decimated samples: the whole
 * flight at overview resolution, then a finer window whenever the user zooms in far enough that the
 * overview gets coarse. Pure functions so the rules can be tested without a browser.
 */

/** A time window in ms from the first sample. */
export interface TimeWindow {
  fromMs: number
  toMs: number
}

/** A request for GET /api/flights/:id/samples. */
export interface SampleRequest extends TimeWindow {
  maxPoints: number
}

/** The most points any one view asks for (the server decimates down to this). */
export const MAX_POINTS_PER_VIEW = 4000
/** The fewest: small screens still get a readable trace. */
export const MIN_POINTS_PER_VIEW = 800
/** Extra time fetched either side of the view, as a share of its width, so small pans need no request. */
export const WINDOW_PADDING_FRACTION = 0.25
/** Ask again once the loaded data is this many times coarser than the view needs. */
export const REFINE_FACTOR = 2

/**
 * Points to ask for, from the drawing width: about two per pixel, clamped to [800, 4000].
 * @param widthPx drawing width in CSS pixels (>= 0)
 */
export function pointsForWidth(widthPx: number): number {
  const wanted = Math.round(Math.max(0, widthPx) * 2)
  return Math.min(MAX_POINTS_PER_VIEW, Math.max(MIN_POINTS_PER_VIEW, wanted))
}

/**
 * The flight screen's chart width guessed from the viewport, for requests sent before the screen has laid out: the
 * side menu (216 px from 1024 px up), the main column (at most 1200 px, padded), the screen's padding, and two
 * columns from 1100 px up. Only the point budget depends on it.
 * @param viewportPx window width in CSS pixels
 */
export function estimatedChartWidthPx(viewportPx: number): number {
  const wide = viewportPx >= 1024
  const main = Math.min(Math.max(0, viewportPx - (wide ? 216 : 0)), 1200) - (wide ? 56 : 32)
  const content = Math.max(0, main - 40)
  return Math.round(viewportPx >= 1100 ? Math.max(0, (content - 12) / 2 - 22) : Math.max(0, content - 22))
}

/** Clamps a window into the flight's span and keeps it at least 1 ms wide. */
export function clampWindow(win: TimeWindow, flight: TimeWindow): TimeWindow {
  const fromMs = Math.max(flight.fromMs, Math.min(win.fromMs, flight.toMs))
  const toMs = Math.min(flight.toMs, Math.max(win.toMs, flight.fromMs))
  return toMs > fromMs ? { fromMs, toMs } : { fromMs, toMs: Math.min(flight.toMs, fromMs + 1) }
}

/**
 * Time window of an ECharts dataZoom given as percentages of the flight.
 * @param startPct 0 … 100
 * @param endPct 0 … 100 (>= startPct)
 */
export function windowFromPercent(startPct: number, endPct: number, flight: TimeWindow): TimeWindow {
  const span = flight.toMs - flight.fromMs
  return clampWindow(
    { fromMs: flight.fromMs + (span * startPct) / 100, toMs: flight.fromMs + (span * endPct) / 100 },
    flight,
  )
}

/** Average spacing of the loaded points, ms per point. */
function spacingMs(req: SampleRequest): number {
  return (req.toMs - req.fromMs) / Math.max(1, req.maxPoints)
}

/**
 * Decides whether the view needs new samples, and which.
 * @param view the time window now on screen
 * @param widthPx drawing width of the view
 * @param loaded the last request that answered (null before the first)
 * @param flight the whole flight's span
 * @param loadedCount points the server actually returned for `loaded` (fewer than asked means full detail)
 * @returns the request to make, or null when what is loaded already covers the view finely enough
 */
export function planSampleRequest(
  view: TimeWindow,
  widthPx: number,
  loaded: SampleRequest | null,
  flight: TimeWindow,
  loadedCount = Infinity,
): SampleRequest | null {
  const v = clampWindow(view, flight)
  const maxPoints = pointsForWidth(widthPx)
  if (loaded) {
    const covers = loaded.fromMs <= v.fromMs && loaded.toMs >= v.toMs
    // the server had fewer raw rows than asked: this is every sample there is in that window
    const complete = loadedCount < loaded.maxPoints
    const neededSpacing = (v.toMs - v.fromMs) / maxPoints
    if (covers && (complete || spacingMs(loaded) <= neededSpacing * REFINE_FACTOR)) return null
  }
  const pad = (v.toMs - v.fromMs) * WINDOW_PADDING_FRACTION
  const padded = clampWindow({ fromMs: v.fromMs - pad, toMs: v.toMs + pad }, flight)
  const isWhole = padded.fromMs === flight.fromMs && padded.toMs === flight.toMs
  // padding widens the window, so ask for proportionally more points (still within the cap)
  const share = (padded.toMs - padded.fromMs) / Math.max(1, v.toMs - v.fromMs)
  const points = isWhole ? maxPoints : Math.min(MAX_POINTS_PER_VIEW, Math.round(maxPoints * share))
  return { fromMs: Math.floor(padded.fromMs), toMs: Math.ceil(padded.toMs), maxPoints: points }
}

/** Query string for a sample request. */
export function sampleQuery(req: SampleRequest): string {
  const p = new URLSearchParams({
    fromMs: String(Math.floor(req.fromMs)),
    toMs: String(Math.ceil(req.toMs)),
    maxPoints: String(req.maxPoints),
  })
  return p.toString()
}

/** A lat/lon box (map bounds). */
export interface LatLonBox {
  south: number
  west: number
  north: number
  east: number
}

/**
 * The time window of the samples that fall inside a map box, so zooming the map refines the same
 * way zooming a chart does. Returns null when no sample is inside.
 */
export function timeWindowInBox(
  tMs: ArrayLike<number>,
  lat: ArrayLike<number | null>,
  lon: ArrayLike<number | null>,
  box: LatLonBox,
): TimeWindow | null {
  let from = Infinity
  let to = -Infinity
  for (let i = 0; i < tMs.length; i++) {
    const a = lat[i]
    const o = lon[i]
    if (a == null || o == null) continue
    if (a < box.south || a > box.north || o < box.west || o > box.east) continue
    const t = tMs[i]!
    if (t < from) from = t
    if (t > to) to = t
  }
  return from === Infinity ? null : { fromMs: from, toMs: to }
}
