import type { DropoutCause } from '../dropouts/classify.js'
import type { RxAntenna, TxAntenna } from './setup.js'
import type { CourseObstacle } from './course.js'

/** The setup of one compared flight, as the table shows it. */
export interface ComparedSetupDto {
  id: number
  name: string
  version: number
  band: string
  freqMHz: number
  txPowerDbm: number
  txPowerMw: number
  txAntenna: TxAntenna
  rxAntennas: RxAntenna[]
  cableLossDb: number
  sensitivityDbm: number
  floorDbm: number | null
}

/** One flight's column of the side-by-side table, with what its charts need. */
export interface ComparedFlightDto {
  flightId: number
  name: string
  flownOn: string
  /** Index into the comparison palette (order of flightIds). */
  styleIndex: number
  isBaseline: boolean
  setup: ComparedSetupDto
  eirpDbm: number
  fit: {
    exponent: number
    exponentLower: number
    exponentUpper: number
    sigmaDb: number
    rSquared: number
    sampleCount: number
  } | null
  /** Model for the fitted curve (fit, or free space when the fit failed). */
  model: { source: 'fit' | 'free-space'; interceptDbm: number; exponent: number; referenceDistanceM: number }
  maxDistanceWithLinkM: number | null
  /** Where the model meets sensitivity + the comparison's fade margin, m. */
  predictedRangeM: number | null
  dropoutsByCause: Record<DropoutCause, number>
  dropoutCount: number
  timeWithoutLinkMs: number
  durationMs: number
  /** Decimated [distance m, best signal dBm] of heard samples, for the signal-vs-distance chart. */
  scatter: Array<[number, number]>
  /** Decimated [lat, lon] track for the map. */
  track: Array<[number, number]>
  /** Where the aircraft typically was from the ground antenna, degrees. */
  typicalAzimuthDeg: number | null
  typicalElevationDeg: number | null
}

/** One flight measured against the baseline. */
export interface AdvantageDto {
  flightId: number
  /** Measured advantage at matched distance, dB, with its 95 % interval; null without shared bins. */
  measuredDb: number | null
  lowerDb: number | null
  upperDb: number | null
  halfWidthDb: number | null
  binCount: number
  /** Bins left out because either flight lost the link too often there. */
  censoredBinCount: number
  /** 10^(Δ/10): the transmit-power factor with the same effect. */
  powerFactor: number | null
  /** Range factor under the compared flight's fitted exponent. */
  rangeFactor: number | null
  exponentUsed: number | null
  /** e.g. "+9.6 dB: like 9.1× the power". */
  phrase: string | null
  /** Advantage the datasheets predict (power, gains, cable loss, pattern at the typical direction), dB. */
  predictedDb: number
  /** measured − predicted, dB. */
  differenceDb: number | null
  /** Set when |measured − predicted| exceeds the interval half-width. */
  flag: 'shortfall' | 'excess' | null
  /** Per-bin difference for the chart: bin centre (m) and dB. */
  bins: Array<[number, number]>
}

/** Everything the compare screen shows for a choice of flights and baseline. */
export interface ComparisonResultDto {
  flightIds: number[]
  baselineId: number
  fadeMarginDb: number
  binWidthM: number
  /** Course of the baseline flight (the map's station and obstacles). */
  course: {
    id: number
    name: string
    stationLat: number
    stationLon: number
    obstacles: CourseObstacle[]
  }
  /** True when the flights were flown on more than one course (matched distances then mean less). */
  mixedCourses: boolean
  flights: ComparedFlightDto[]
  advantages: AdvantageDto[]
}

/** A saved comparison. */
export interface ComparisonDto {
  id: number
  name: string
  conclusion: string
  flightIds: number[]
  baselineId: number
  fadeMarginDb: number
  createdBy: number | null
  createdByName: string | null
  createdAt: string
  updatedAt: string
}

/** GET /api/comparisons/:id: the saved choices and their result, recomputed. */
export interface ComparisonDetailDto extends ComparisonDto {
  result: ComparisonResultDto
}

/** Name of the comparison the demo scenario saves; the overview offers it in one click. */
export const DEMO_COMPARISON_NAME = 'Power vs antenna'
