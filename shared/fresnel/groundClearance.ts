/**
 * Smallest F1 clearance fraction of the ray above flat ground (with earth bulge) between station and aircraft.
 * @param pathLengthM horizontal path length in metres, > 0
 * @param groundAntennaHeightM antenna height above the ground datum in metres, > 0
 * @param aircraftHeightM aircraft height above the datum in metres
 * @param wavelengthMetres carrier wavelength in metres, > 0
 * @param twoKEarthRadiusM 2·k·Re in metres, > 0
 * @param cap values at or above this are returned as cap without the square roots (default +Infinity)
 * @returns min(clearance / F1 at the worst point, cap) (+Infinity for a zero-length path)
 * @throws never: a hot-loop helper, the caller validates once per flight
 */
export function groundClearanceFraction(
  pathLengthM: number,
  groundAntennaHeightM: number,
  aircraftHeightM: number,
  wavelengthMetres: number,
  twoKEarthRadiusM: number,
  cap = Infinity,
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
  const num1 = hg + dh * tStar - bulgeScale * w1
  const num2 = hg + dh * 0.5 - bulgeScale * 0.25
  // both points clear by cap·F1 or more: compare squares and skip the roots and the division
  const capSq = cap * cap
  if (cap > 0 && num1 > 0 && num2 > 0 && num1 * num1 >= capSq * lamD * w1 && num2 * num2 >= capSq * lamD * 0.25) {
    return cap
  }
  const root1 = Math.sqrt(lamD * w1)
  const root2 = Math.sqrt(lamD * 0.25)
  // compare num1/root1 with num2/root2 by cross-multiplying (roots > 0): one division instead of two
  return num1 * root2 < num2 * root1 ? num1 / root1 : num2 / root2
}
