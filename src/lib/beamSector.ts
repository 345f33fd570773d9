import { offsetToLatLonDeg } from '@shared/demo/localInverse'

/** [lat, lon] in degrees, Leaflet's order. */
export type LatLngPair = [number, number]

/**
 * Outline of a directional antenna's half-power sector, from the station out to a radius: the
 * polygon a pilot sees on the map to judge how wide the beam really is at the far end of the course.
 * @param stationLat station latitude, degrees
 * @param stationLon station longitude, degrees
 * @param azimuthDeg boresight, degrees clockwise from true north
 * @param beamwidthDeg full half-power beamwidth, degrees (0, 360)
 * @param radiusM how far out to draw, metres (> 0)
 * @param steps arc segments (default 32)
 * @returns closed ring starting and ending at the station
 */
export function beamSectorRing(
  stationLat: number,
  stationLon: number,
  azimuthDeg: number,
  beamwidthDeg: number,
  radiusM: number,
  steps = 32,
): LatLngPair[] {
  if (!(beamwidthDeg > 0 && beamwidthDeg < 360)) throw new RangeError(`beamwidthDeg must be in (0, 360), got ${beamwidthDeg}`)
  if (!(radiusM > 0)) throw new RangeError(`radiusM must be > 0, got ${radiusM}`)
  const ring: LatLngPair[] = [[stationLat, stationLon]]
  const start = azimuthDeg - beamwidthDeg / 2
  for (let i = 0; i <= steps; i++) {
    const bearingRad = ((start + (beamwidthDeg * i) / steps) * Math.PI) / 180
    // bearing is clockwise from north: east = sin, north = cos
    const p = offsetToLatLonDeg(stationLat, stationLon, radiusM * Math.sin(bearingRad), radiusM * Math.cos(bearingRad))
    ring.push([p.latDeg, p.lonDeg])
  }
  ring.push([stationLat, stationLon])
  return ring
}
