/**
 * Ellipsoid's own signal colour ramp: night indigo → blue → teal → spring green → pale yellow.
 * Lightness rises steadily from end to end, so the order reads in greyscale and for red/green
 * colour-blind viewers alike (there is no red/green contrast in it); weak signal is dark, strong is bright.
 */
export const SIGNAL_RAMP: readonly string[] = [
  '#1b1446', // 0.00  night indigo
  '#2a3a86', // 0.25  deep blue
  '#1f7a99', // 0.50  steel teal
  '#3fb28a', // 0.75  sea green
  '#f2e65a', // 1.00  pale yellow
]

/** Colour for samples where the receiver logged no usable signal (floor value, missing). */
export const NO_SIGNAL_COLOUR = '#8c8c8c'

export interface SignalDomain {
  /** Value painted at the dark end, dBm. */
  lowDbm: number
  /** Value painted at the bright end, dBm. */
  highDbm: number
}

type Rgb = [number, number, number]

function hexToRgb(hex: string): Rgb {
  const n = Number.parseInt(hex.slice(1), 16)
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255]
}

function rgbToHex([r, g, b]: Rgb): string {
  return `#${((1 << 24) | (r << 16) | (g << 8) | b).toString(16).slice(1)}`
}

const RAMP_RGB: Rgb[] = SIGNAL_RAMP.map(hexToRgb)

/**
 * Colour at a position on the ramp.
 * @param fraction 0 (weakest) … 1 (strongest); values outside are clamped, NaN gives NO_SIGNAL_COLOUR
 * @returns '#rrggbb'
 */
export function rampColour(fraction: number): string {
  if (!Number.isFinite(fraction)) return NO_SIGNAL_COLOUR
  const f = Math.min(1, Math.max(0, fraction)) * (RAMP_RGB.length - 1)
  const i = Math.min(RAMP_RGB.length - 2, Math.floor(f))
  const t = f - i
  const a = RAMP_RGB[i]!
  const b = RAMP_RGB[i + 1]!
  return rgbToHex([0, 1, 2].map((k) => Math.round(a[k]! + (b[k]! - a[k]!) * t)) as Rgb)
}

/**
 * Colour for one signal reading within a domain.
 * @param signalDbm reading in dBm; null/NaN (no reading) gives NO_SIGNAL_COLOUR
 * @param domain lowDbm < highDbm
 */
export function signalColour(signalDbm: number | null | undefined, domain: SignalDomain): string {
  if (signalDbm == null || !Number.isFinite(signalDbm)) return NO_SIGNAL_COLOUR
  const span = domain.highDbm - domain.lowDbm
  if (!(span > 0)) throw new RangeError(`domain must have highDbm > lowDbm, got ${domain.lowDbm}…${domain.highDbm}`)
  return rampColour((signalDbm - domain.lowDbm) / span)
}

/**
 * The domain a flight is painted in: from the receiver's sensitivity (the edge of the link) up to the
 * strongest reading, rounded out to 5 dB so the legend shows round numbers.
 * @param values readings in dBm (NaN/null ignored)
 * @param sensitivityDbm the setup's sensitivity, or null when unknown (then the weakest reading is used)
 */
export function signalDomainFor(
  values: ArrayLike<number | null>,
  sensitivityDbm: number | null,
): SignalDomain {
  let min = Infinity
  let max = -Infinity
  for (let i = 0; i < values.length; i++) {
    const v = values[i]
    if (v == null || !Number.isFinite(v)) continue
    if (v < min) min = v
    if (v > max) max = v
  }
  if (min === Infinity) return { lowDbm: sensitivityDbm ?? -100, highDbm: (sensitivityDbm ?? -100) + 60 }
  const low = Math.floor((sensitivityDbm ?? min) / 5) * 5
  let high = Math.ceil(max / 5) * 5
  if (high - low < 10) high = low + 10
  return { lowDbm: low, highDbm: high }
}

/** The ramp as a CSS linear-gradient (left = weak) for legends. */
export function rampGradientCss(direction = 'to right'): string {
  const stops = SIGNAL_RAMP.map((c, i) => `${c} ${Math.round((i / (SIGNAL_RAMP.length - 1)) * 100)}%`)
  return `linear-gradient(${direction}, ${stops.join(', ')})`
}

/** Relative luminance (WCAG 2.x definition) of '#rrggbb', 0 … 1. */
export function relativeLuminance(hex: string): number {
  const lin = hexToRgb(hex).map((c) => {
    const s = c / 255
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4
  })
  return 0.2126 * lin[0]! + 0.7152 * lin[1]! + 0.0722 * lin[2]!
}

/** Evenly spaced legend ticks across a domain, e.g. every 10 dB. */
export function legendTicksDbm(domain: SignalDomain, count = 5): number[] {
  const step = (domain.highDbm - domain.lowDbm) / (count - 1)
  return Array.from({ length: count }, (_, i) => Math.round(domain.lowDbm + i * step))
}
