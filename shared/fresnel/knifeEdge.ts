import { requireFinite, requirePositive } from '../units/guards.js'

/**
 * Knife-edge diffraction parameter from clearance and first-zone radius, ν = −√2·clearance/F1.
 * @param clearanceM clearance of the ray above the edge in metres, finite (negative when blocked)
 * @param f1RadiusM first Fresnel zone radius at the edge in metres, > 0
 * @returns ν, dimensionless (negative when clear)
 * @throws RangeError when an argument is out of range
 */
export function knifeEdgeNu(clearanceM: number, f1RadiusM: number): number {
  requireFinite('clearanceM', clearanceM)
  requirePositive('f1RadiusM', f1RadiusM)
  // ITU-R P.526 §4.1: ν = h·√(2/λ·(1/d1 + 1/d2)) with h = −clearance, i.e. −√2·clearance/F1
  return (-Math.SQRT2 * clearanceM) / f1RadiusM
}

/**
 * Single knife-edge diffraction loss J(ν), the ITU-R P.526 approximation.
 * @param nu diffraction parameter ν, finite
 * @returns loss in dB, >= 0 (0 for ν <= −0.78)
 * @throws RangeError when nu is not finite
 */
export function knifeEdgeLossDb(nu: number): number {
  requireFinite('nu', nu)
  if (nu <= -0.78) return 0
  // ITU-R P.526 §4.1 eq. (31): J(ν) = 6.9 + 20·log10(√((ν−0.1)²+1) + ν − 0.1), valid for ν > −0.78
  const v = nu - 0.1
  return 6.9 + 20 * Math.log10(Math.sqrt(v * v + 1) + v)
}
