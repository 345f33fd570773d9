/** Which coordinate a text gives: sets the valid range and the hemisphere letters. */
export type CoordAxis = 'lat' | 'lon'

const HEMI: Record<CoordAxis, { pos: string; neg: string; max: number }> = {
  lat: { pos: 'N', neg: 'S', max: 90 },
  lon: { pos: 'E', neg: 'W', max: 180 },
}

/**
 * Parses one coordinate typed as decimal degrees ("51.4768", "-1.25") or degrees-minutes-seconds
 * ("51°28'36.5\"N", "51 28 36.5 N", "W 1° 15.5'"). A hemisphere letter and a minus sign
 * together are refused, as is a letter of the other axis.
 * @param text the typed coordinate
 * @param axis 'lat' or 'lon', for the range (±90 / ±180) and the letters (N/S, E/W)
 * @returns signed decimal degrees
 * @throws RangeError naming the problem when the text is not a coordinate of that axis
 */
export function parseCoordinate(text: string, axis: CoordAxis): number {
  const h = HEMI[axis]
  let s = text.trim().toUpperCase().replace(/,/g, '.')
  if (!s) throw new RangeError(`${axis}: enter a coordinate`)
  let sign = 1
  const lead = s.match(/^([NSEW])\s*/)
  const trail = s.match(/\s*([NSEW])$/)
  const letter = lead?.[1] ?? trail?.[1]
  if (lead && trail) throw new RangeError(`${axis}: give the hemisphere once`)
  if (letter) {
    if (letter !== h.pos && letter !== h.neg) throw new RangeError(`${axis}: ${letter} is not a ${axis === 'lat' ? 'latitude' : 'longitude'} hemisphere`)
    if (letter === h.neg) sign = -1
    s = lead ? s.slice(lead[0].length) : s.slice(0, s.length - (trail?.[0].length ?? 0))
  }
  if (s.startsWith('-') || s.startsWith('+')) {
    if (letter) throw new RangeError(`${axis}: use either a sign or a hemisphere letter, not both`)
    if (s.startsWith('-')) sign = -1
    s = s.slice(1).trim()
  }
  // split on degree/minute/second marks or whitespace
  const parts = s.split(/[°º'′"″\s]+/).filter((p) => p.length > 0)
  if (parts.length < 1 || parts.length > 3 || !parts.every((p) => /^\d+(\.\d+)?$/.test(p))) {
    throw new RangeError(`${axis}: "${text}" is not a coordinate (try 51.4768 or 51°28'36.5"N)`)
  }
  const [d, m = 0, sec = 0] = parts.map(Number) as [number, number?, number?]
  if (parts.length > 1 && !Number.isInteger(d)) throw new RangeError(`${axis}: degrees must be whole when minutes follow`)
  if (parts.length > 2 && !Number.isInteger(m)) throw new RangeError(`${axis}: minutes must be whole when seconds follow`)
  if (m >= 60) throw new RangeError(`${axis}: minutes must be below 60`)
  if (sec >= 60) throw new RangeError(`${axis}: seconds must be below 60`)
  const value = sign * (d + m / 60 + sec / 3600)
  if (Math.abs(value) > h.max) throw new RangeError(`${axis}: must be within ±${h.max}°`)
  return value
}

/**
 * Formats decimal degrees as degrees, minutes and seconds with a hemisphere letter.
 * @param valueDeg signed decimal degrees, finite
 * @param axis 'lat' or 'lon'
 * @param secondDigits decimals on the seconds (default 1)
 * @returns text such as 51°28′36.5″N
 * @throws RangeError when valueDeg is not finite
 */
export function formatDms(valueDeg: number, axis: CoordAxis, secondDigits = 1): string {
  if (!Number.isFinite(valueDeg)) throw new RangeError(`valueDeg must be finite, got ${valueDeg}`)
  const h = HEMI[axis]
  const scale = 10 ** secondDigits
  let totalSec = Math.round(Math.abs(valueDeg) * 3600 * scale) / scale
  const d = Math.floor(totalSec / 3600)
  totalSec -= d * 3600
  const m = Math.floor(totalSec / 60)
  const sec = totalSec - m * 60
  return `${d}°${String(m).padStart(2, '0')}′${sec.toFixed(secondDigits).padStart(secondDigits + 3, '0')}″${valueDeg < 0 ? h.neg : h.pos}`
}
