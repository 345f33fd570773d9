// Loads the reference figures from fixtures/reference and maps each check's `fn` to the library.
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import {
  allowedPathLossDb,
  dbmToMw,
  earthBulgeM,
  elevationAngleCurvedDeg,
  elevationAngleDeg,
  equivalentTxPowerMw,
  fitLogDistance,
  freeSpaceLossDb,
  freeSpaceLossPracticalDb,
  freeSpaceMarginDb,
  freeSpaceRangeM,
  freeSpaceRangePracticalM,
  fresnelZoneRadiusM,
  FSPL_EXACT_CONSTANT_DB,
  gainFromBeamwidthsDbi,
  geodesicInverse,
  haversineDistanceM,
  lineOfSightClearance,
  type LinkBudget,
  type LogDistanceFit,
  mwToDbm,
  offBoresightAngleDeg,
  parabolicPatternDb,
  predictRxPowerDbm,
  rangeFactor,
  rangeGainPercent,
  ratioToDb,
  receivedPowerDbm,
  referenceLossDb,
  REQUIRED_CLEARANCE_FRACTION,
  requiredClearanceM,
  slantRangeM,
  sphericalInitialBearingDeg,
  sphericalScaleError,
  twoRayBreakpointM,
  twoRayCrossoverM,
  twoRayLastPeakM,
  twoRayNullCount,
  twoRayNullDistanceApproxM,
  twoRayNullDistanceM,
  wavelengthM,
  eirpDbm,
} from '../../shared/index.js'

export interface Tolerance {
  abs?: number
  rel?: number
  exact?: boolean
  wrap?: number
}

export interface Check {
  id: string
  group: string
  fn: string
  inputs: Record<string, number | string>
  expected: number | boolean
  unit: string
  tolerance: Tolerance
  source: string
  source_kind: 'standard' | 'textbook' | 'reference-library' | 'common-practice' | 'memory'
}

interface CheckFile {
  count: number
  checks: Check[]
}

const fixtureDir = fileURLToPath(new URL('../../fixtures/reference/', import.meta.url))

/** All checks from fixtures/reference/check-values.json. */
export const checkFile: CheckFile = JSON.parse(readFileSync(`${fixtureDir}check-values.json`, 'utf8'))

/** How each source kind is named in test titles. */
export function kindLabel(kind: Check['source_kind']): string {
  switch (kind) {
    case 'common-practice':
      return 'common practice, no source'
    case 'memory':
      return 'from memory'
    default:
      return kind
  }
}

/** Test title naming the check, its source key and the kind of source. */
export function checkTitle(c: Check): string {
  return `${c.id} [${c.source}; ${kindLabel(c.source_kind)}]`
}

/** The checks of one group, keyed by fn in file order. */
export function checksByFn(group: string): Map<string, Check[]> {
  const out = new Map<string, Check[]>()
  for (const c of checkFile.checks) {
    if (c.group !== group) continue
    const list = out.get(c.fn) ?? []
    list.push(c)
    out.set(c.fn, list)
  }
  return out
}

/** True when actual meets the check's tolerance (abs/rel either, exact, wrap 360). */
export function withinTolerance(actual: number | boolean, expected: number | boolean, tol: Tolerance): boolean {
  if (tol.exact) return actual === expected
  if (typeof actual !== 'number' || typeof expected !== 'number' || !Number.isFinite(actual)) return false
  let diff = actual - expected
  if (tol.wrap) diff = ((((diff + tol.wrap / 2) % tol.wrap) + tol.wrap) % tol.wrap) - tol.wrap / 2
  const err = Math.abs(diff)
  if (tol.abs !== undefined && err <= tol.abs) return true
  if (tol.rel !== undefined && err <= tol.rel * Math.abs(expected)) return true
  return false
}

/** Reads one of the log-distance data sets (columns d_m, rssi_dbm). */
export function readLogfitCsv(file: string): { distanceM: Float64Array; rssiDbm: Float64Array } {
  const lines = readFileSync(`${fixtureDir}${file}`, 'utf8').trim().split(/\r?\n/)
  const rows = lines.slice(1).map((l) => l.split(',').map(Number))
  return {
    distanceM: Float64Array.from(rows, (r) => r[0]!),
    rssiDbm: Float64Array.from(rows, (r) => r[1]!),
  }
}

const fits = new Map<string, LogDistanceFit>()
function fitOf(file: string, d0: number): LogDistanceFit {
  const key = `${file}@${d0}`
  let f = fits.get(key)
  if (!f) {
    const data = readLogfitCsv(file)
    f = fitLogDistance(data.distanceM, data.rssiDbm, { referenceDistanceM: d0 })
    fits.set(key, f)
  }
  return f
}

type Inputs = Record<string, number | string>
const num = (i: Inputs, k: string): number => {
  const v = i[k]
  if (typeof v !== 'number') throw new TypeError(`input ${k} missing`)
  return v
}
const hz = (i: Inputs) => num(i, 'f_mhz') * 1e6
const budgetOf = (i: Inputs): LinkBudget => ({
  txPowerDbm: num(i, 'pt_dbm'),
  txGainDbi: num(i, 'gt_dbi'),
  rxGainDbi: num(i, 'gr_dbi'),
  txLossDb: typeof i.ltx_db === 'number' ? i.ltx_db : 0,
  // the allowed-loss checks give one total cable loss; it sits on the receive side
  rxLossDb: typeof i.lrx_db === 'number' ? i.lrx_db : num(i, 'lcables_db'),
  freqHz: hz(i),
})
const losCase = (i: Inputs) =>
  lineOfSightClearance(
    {
      freqHz: hz(i),
      groundAntennaHeightM: num(i, 'h_ground_m'),
      aircraftHeightM: num(i, 'h_air_m'),
      pathLengthM: num(i, 'dist_m'),
      kFactor: num(i, 'k'),
      earthRadiusM: num(i, 're_km') * 1000,
    },
    num(i, 'obs_dist_m'),
    num(i, 'obs_h_m'),
  )
const fix = (i: Inputs) => [num(i, 'lat1'), num(i, 'lon1'), num(i, 'lat2'), num(i, 'lon2')] as const
const fileOf = (i: Inputs) => String(i.file)

/** Library call for each fn of the reference file. */
export const evaluators: Record<string, (i: Inputs) => number | boolean> = {
  mw_to_dbm: (i) => mwToDbm(num(i, 'p_mw')),
  dbm_to_mw: (i) => dbmToMw(num(i, 'p_dbm')),
  ratio_to_db: (i) => ratioToDb(num(i, 'power_ratio')),
  wavelength_m: (i) => wavelengthM(hz(i)),
  fspl_p525_db: (i) => freeSpaceLossPracticalDb(num(i, 'd_km') * 1000, hz(i)),
  fspl_exact_db: (i) => freeSpaceLossDb(num(i, 'd_km') * 1000, hz(i)),
  fspl_constant_db: () => FSPL_EXACT_CONSTANT_DB,
  eirp_dbm: (i) => eirpDbm(num(i, 'pt_dbm'), num(i, 'gt_dbi'), num(i, 'ltx_db')),
  received_power_dbm: (i) => receivedPowerDbm(budgetOf(i), num(i, 'd_km') * 1000),
  link_margin_db: (i) => freeSpaceMarginDb(budgetOf(i), num(i, 'd_km') * 1000, num(i, 'sens_dbm')),
  allowed_path_loss_db: (i) => allowedPathLossDb(budgetOf(i), num(i, 'sens_dbm'), num(i, 'fade_margin_db')),
  max_fs_range_km: (i) => freeSpaceRangeM(budgetOf(i), num(i, 'sens_dbm'), num(i, 'fade_margin_db')) / 1000,
  max_fs_range_km_p525: (i) =>
    freeSpaceRangePracticalM(budgetOf(i), num(i, 'sens_dbm'), num(i, 'fade_margin_db')) / 1000,
  range_ratio: (i) => rangeFactor(num(i, 'delta_db'), num(i, 'n')),
  range_gain_pct: (i) => rangeGainPercent(num(i, 'delta_db'), num(i, 'n')),
  equivalent_tx_power_mw: (i) => equivalentTxPowerMw(num(i, 'p_mw'), num(i, 'gain_change_db')),
  fit_count: (i) => fitOf(fileOf(i), num(i, 'd0_m')).sampleCount,
  fit_path_loss_exponent: (i) => fitOf(fileOf(i), num(i, 'd0_m')).exponent,
  fit_slope: (i) => fitOf(fileOf(i), num(i, 'd0_m')).slopeDbPerDecade,
  fit_intercept_dbm: (i) => fitOf(fileOf(i), num(i, 'd0_m')).interceptDbm,
  fit_reference_loss_db: (i) => referenceLossDb(fitOf(fileOf(i), num(i, 'd0_m')), num(i, 'eirp_dbm')),
  fit_residual_sigma_n_minus_2: (i) => fitOf(fileOf(i), num(i, 'd0_m')).residualSigmaDb,
  fit_residual_sigma_n: (i) => fitOf(fileOf(i), num(i, 'd0_m')).residualSigmaPopulationDb,
  fit_r_squared: (i) => fitOf(fileOf(i), num(i, 'd0_m')).rSquared,
  fit_stderr_n: (i) => fitOf(fileOf(i), num(i, 'd0_m')).exponentStdErr,
  fit_predict_rssi_dbm: (i) => predictRxPowerDbm(fitOf(fileOf(i), num(i, 'd0_m')), num(i, 'd_m')),
  fresnel_radius_m: (i) =>
    'zone' in i
      ? fresnelZoneRadiusM(hz(i), num(i, 'd1_km') * 1000, num(i, 'd2_km') * 1000, num(i, 'zone'))
      : losCase(i).f1RadiusM,
  required_clearance_fraction: () => REQUIRED_CLEARANCE_FRACTION,
  required_clearance_m: (i) => requiredClearanceM(hz(i), num(i, 'd1_km') * 1000, num(i, 'd2_km') * 1000),
  earth_bulge_m: (i) =>
    'd1_km' in i
      ? earthBulgeM(num(i, 'd1_km') * 1000, num(i, 'd2_km') * 1000, num(i, 'k'), num(i, 're_km') * 1000)
      : losCase(i).bulgeM,
  los_ray_height_m: (i) => losCase(i).rayHeightM,
  los_clearance_m: (i) => losCase(i).clearanceM,
  los_clearance_flat_m: (i) => losCase(i).clearanceFlatM,
  clearance_over_f1: (i) => losCase(i).clearanceFraction,
  meets_60pct_rule: (i) => losCase(i).meetsClearanceRule,
  knife_edge_nu: (i) => losCase(i).knifeEdgeNu,
  knife_edge_loss_db: (i) => losCase(i).knifeEdgeLossDb,
  geodesic_distance_m: (i) => geodesicInverse(...fix(i)).distanceM,
  geodesic_initial_bearing_deg: (i) => geodesicInverse(...fix(i)).initialBearingDeg,
  geodesic_final_bearing_deg: (i) => geodesicInverse(...fix(i)).finalBearingDeg,
  haversine_distance_m: (i) => haversineDistanceM(...fix(i)),
  haversine_rel_diff: (i) => {
    const g = geodesicInverse(...fix(i)).distanceM
    return (haversineDistanceM(...fix(i)) - g) / g
  },
  spherical_initial_bearing_deg: (i) => sphericalInitialBearingDeg(...fix(i)),
  spherical_bearing_diff_deg: (i) =>
    sphericalInitialBearingDeg(...fix(i)) - geodesicInverse(...fix(i)).initialBearingDeg,
  sphere_over_ellipsoid_scale_minus_1: (i) =>
    // at the pole both radii of curvature are a²/b, so "any" direction uses the meridian one
    sphericalScaleError(num(i, 'lat'), i.direction === 'east-west' ? 'east-west' : 'north-south', num(i, 'r_sphere_m')),
  pattern_rel_gain_db: (i) => {
    const theta =
      'theta_deg' in i
        ? num(i, 'theta_deg')
        : offBoresightAngleDeg(
            num(i, 'boresight_az_deg'),
            num(i, 'boresight_el_deg'),
            num(i, 'target_az_deg'),
            num(i, 'target_el_deg'),
          )
    return parabolicPatternDb(theta, num(i, 'theta3db_deg'), num(i, 'am_db'))
  },
  gain_from_beamwidth_dbi: (i) =>
    gainFromBeamwidthsDbi(num(i, 'theta_e_deg'), num(i, 'theta_h_deg'), num(i, 'constant')),
  two_ray_null_distance_m: (i) => twoRayNullDistanceM(num(i, 'k'), hz(i), num(i, 'ht_m'), num(i, 'hr_m')),
  two_ray_null_distance_approx_m: (i) =>
    twoRayNullDistanceApproxM(num(i, 'k'), hz(i), num(i, 'ht_m'), num(i, 'hr_m')),
  two_ray_null_count: (i) => twoRayNullCount(hz(i), num(i, 'ht_m'), num(i, 'hr_m'), num(i, 'd_max_m')),
  two_ray_breakpoint_m: (i) => twoRayBreakpointM(hz(i), num(i, 'ht_m'), num(i, 'hr_m')),
  two_ray_last_peak_m: (i) => twoRayLastPeakM(hz(i), num(i, 'ht_m'), num(i, 'hr_m')),
  two_ray_crossover_m: (i) => twoRayCrossoverM(hz(i), num(i, 'ht_m'), num(i, 'hr_m')),
  elevation_angle_deg: (i) => elevationAngleDeg(num(i, 'd_horizontal_m'), num(i, 'dh_m')),
  slant_range_m: (i) => slantRangeM(num(i, 'd_horizontal_m'), num(i, 'dh_m')),
  elevation_angle_curved_deg: (i) =>
    elevationAngleCurvedDeg(num(i, 'd_ground_m'), num(i, 'h1_m'), num(i, 'h2_m'), num(i, 'k'), num(i, 're_km') * 1000),
  off_boresight_deg: (i) =>
    offBoresightAngleDeg(
      num(i, 'boresight_az_deg'),
      num(i, 'boresight_el_deg'),
      num(i, 'target_az_deg'),
      num(i, 'target_el_deg'),
    ),
}

/** Registers one `it` per check of a group, grouped by fn, each comparing the library within tolerance. */
export function describeGroup(
  group: string,
  api: {
    describe: (name: string, fn: () => void) => void
    it: (name: string, fn: () => void) => void
    expect: (v: unknown, msg?: string) => { toBe: (v: unknown) => void }
  },
): void {
  for (const [fn, checks] of checksByFn(group)) {
    api.describe(fn, () => {
      for (const c of checks) {
        api.it(checkTitle(c), () => {
          const evaluate = evaluators[c.fn]
          api.expect(typeof evaluate, `no evaluator for ${c.fn}`).toBe('function')
          const actual = evaluate!(c.inputs)
          const msg = `${c.id}: got ${String(actual)}, expected ${String(c.expected)} within ${JSON.stringify(c.tolerance)}`
          api.expect(withinTolerance(actual, c.expected, c.tolerance), msg).toBe(true)
        })
      }
    })
  }
}
