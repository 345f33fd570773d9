/** One series style: a colour plus a dash pattern, so lines differ even without colour. */
export interface SeriesStyle {
  /** CSS hex colour. */
  colour: string
  /** Human name for legends and screen readers. */
  name: string
  /** ECharts/Leaflet dash pattern in pixels; empty = solid. */
  dash: number[]
}

/**
 * Ellipsoid's comparison palette, chosen by search for the largest smallest CIE76 distance between any two
 * colours under normal vision and simulated protanopia, deuteranopia and tritanopia (see colourVision.ts),
 * with lightness kept between L* 28 and 72 so every colour reads on light map tiles.
 */
export const COMPARE_PALETTE: readonly SeriesStyle[] = Object.freeze([
  { colour: '#0c28d0', name: 'cobalt', dash: [] },
  { colour: '#d8880c', name: 'amber', dash: [8, 4] },
  { colour: '#900000', name: 'oxblood', dash: [2, 3] },
  { colour: '#68ac80', name: 'sage', dash: [10, 3, 2, 3] },
  { colour: '#7c306c', name: 'plum', dash: [4, 4] },
  { colour: '#cc98dc', name: 'lilac', dash: [12, 6] },
])

/**
 * Style of the i-th compared flight; wraps after six.
 * @param index position of the flight in the comparison, integer >= 0
 * @returns colour, name and dash pattern
 * @throws RangeError when index is not a non-negative integer
 */
export function seriesStyle(index: number): SeriesStyle {
  if (!Number.isInteger(index) || index < 0) throw new RangeError(`index must be an integer >= 0, got ${index}`)
  return COMPARE_PALETTE[index % COMPARE_PALETTE.length]!
}
