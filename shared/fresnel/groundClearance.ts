/**
 * Smallest F1 clearance fraction of the ray above flat ground (with earth bulge) between station and aircraft.
 * @param pathLengthM horizontal path length in metres, > 0
 * @param groundAntennaHeightM antenna height above the ground datum in metres, > 0
 * @param aircraftHeightM aircraft height above the datum in metres
 * @param wavelengthMetres carrier wavelength in metres, > 0
 * @param twoKEarthRadiusM 2·k·Re in metres, > 0
 * @returns clearance / F1 at the worst point (+Infinity for a zero-length path)
 * @throws never: a hot-loop helper, the caller validates once per flight
 */
export function groundClearanceFraction(
  pathLengthM: number,
  groundAntennaHeightM: number,
  aircraftHeightM: number,
  wavelengthMetres: number,
  twoKEarthRadiusM: number,
): number {
  if (!(pathLengthM > 0)) return Infinity
  const hg = groundAntennaHeightM
  const dh = aircraftHeightM - hg
  const lamD = wavelengthMetres * pathLengthM
  const bulgeScale = (pathLengthM * pathLengthM) / twoKEarthRadiusM
  // without bulge, (hg + dh·t)/√(λD·t(1−t)) is least at t* = hg/(hg + ha) (set the derivative to 0);
  // the bulge pulls the worst point toward mid-path, so mid-path is checked too
  const denom = hg + aircraftHeightM
  let tStar = denom > 0 ? hg / denom : 0.99
  if (tStar < 0.01) tStar = 0.01
  else if (tStar > 0.99) tStar = 0.99
  const w1 = tStar * (1 - tStar)
  const f1 = (hg + dh * tStar - bulgeScale * w1) / Math.sqrt(lamD * w1)
  const f2 = (hg + dh * 0.5 - bulgeScale * 0.25) / Math.sqrt(lamD * 0.25)
  return f1 < f2 ? f1 : f2
}
