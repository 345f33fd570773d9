import { type AltitudeReference } from '../geo/slant.js'
import { type Obstacle } from '../fresnel/obstacles.js'
import { type FitSelectionRule } from '../propagation/fitSelection.js'
import { type LogDistanceFit } from '../propagation/logDistanceFit.js'
import { type DropoutDetectionOptions } from '../dropouts/detect.js'
import { type ClassifiedDropout, type DropoutCause, type DropoutClassificationOptions } from '../dropouts/classify.js'

/** Telemetry of one flight as parallel typed arrays (one entry per frame). */
export interface FlightSamples {
  /** Frame time, ms, non-decreasing. */
  timeMs: Float64Array
  /** Latitude and longitude, degrees; NaN or an exact 0,0 pair means no fix. */
  latDeg: Float64Array
  lonDeg: Float64Array
  /** Altitude, metres, referenced as FlightInput.altitudeReference says. */
  altM: Float64Array
  /** Received power at the first (or only) antenna, dBm; NaN = not logged. */
  rssiDbm: Float64Array
  /** Received power at the second diversity antenna, dBm; NaN = not logged. */
  rssi2Dbm?: Float64Array
  /** Link quality, percent. */
  lqPct?: Float64Array
  /** Signal-to-noise ratio, dB (carried for callers, not used by the rules). */
  snrDb?: Float64Array
}

/** Where the ground station stands. */
export interface GroundStation {
  latDeg: number
  lonDeg: number
  /** Antenna height above the ground it stands on, m (> 0). */
  antennaHeightM: number
  /** Ground elevation above mean sea level, m; the datum for all heights. */
  groundElevM: number
}

/** A ground receive antenna; rxAntennas[i] receives rssiDbm (i = 0) or rssi2Dbm (i = 1). */
export interface ReceiveAntenna {
  gainDbi: number
  kind: 'omni' | 'directional'
  /** Half-power beamwidth, degrees; estimated from the gain (32400 rule) when absent. */
  beamwidthDeg?: number
  /** Boresight azimuth, degrees clockwise from true north (required for directional). */
  azimuthDeg?: number
  /** Boresight elevation, degrees (default 0). */
  elevationDeg?: number
}

/** Radio setup of the flight. */
export interface LinkSetup {
  freqMHz: number
  txPowerDbm: number
  txGainDbi: number
  rxAntennas: ReceiveAntenna[]
  /** All cable and connector losses of the link, dB (>= 0). */
  cableLossDb: number
  sensitivityDbm: number
  /** Value the log writes when nothing is heard, dBm. */
  floorDbm?: number | null
}

/** Terrain elevation lookup, e.g. from a DEM tile. */
export interface TerrainSampler {
  /** Ground elevation above mean sea level at a position, m. */
  elevationAmslM(latDeg: number, lonDeg: number): number
  /** Points checked along each path (default 16). */
  samplesPerPath?: number
}

/** Everything analyseFlight needs about one flight. */
export interface FlightInput {
  samples: FlightSamples
  station: GroundStation
  altitudeReference: AltitudeReference
  setup: LinkSetup
  obstacles?: Obstacle[]
  terrain?: TerrainSampler
}

/** Tunable rules; every field has a default. */
export interface AnalysisOptions {
  /** Margin kept above sensitivity, dB (default 10, common practice 10–20). */
  fadeMarginDb?: number
  /** Effective-earth-radius factor (default 4/3). */
  kFactor?: number
  /** Reference distance of the fit, m (default 1). */
  referenceDistanceM?: number
  /** Changes to the default fit selection rule. */
  fitSelection?: Partial<FitSelectionRule>
  /** Changes to dropout detection (sensitivity and floor come from the setup). */
  detection?: Partial<Omit<DropoutDetectionOptions, 'sensitivityDbm' | 'floorDbm'>>
  /** Changes to the classification thresholds. */
  classification?: Partial<Omit<DropoutClassificationOptions, 'fadeMarginDb'>>
}

/** Per-sample results for callers that store them. */
export interface FlightSeries {
  /** Ground distance from the station, m (NaN without a fix). */
  distanceM: Float64Array
  /** Worst first-Fresnel-zone clearance fraction (ground, terrain, obstacles), capped at 1 (zone wholly clear). */
  clearanceFraction: Float32Array
  /** Measured margin: best-antenna power minus sensitivity, dB (NaN when not logged); built on first read. */
  marginDb: Float32Array
  /** Best of the diversity antennas, dBm (the input rssiDbm array without a second antenna). */
  rxBestDbm: Float64Array | Float32Array
  /** 1 inside a dropout. */
  inDropout: Uint8Array
}

/** Plain JSON-serialisable analysis of a flight (no NaN or Infinity: absent values are null). */
export interface FlightAnalysis {
  methodVersion: string
  sampleCount: number
  validFixCount: number
  distances: { minDistanceM: number | null; maxDistanceM: number | null; maxSlantRangeM: number | null; maxHeightM: number | null }
  fit: LogDistanceFit | null
  /** Why no fit was made, when fit is null. */
  fitError: string | null
  fitSelection: {
    rule: FitSelectionRule
    includedCount: number
    excluded: { missing: number; tooClose: number; atFloor: number; inDropout: number; obstructed: number }
  }
  /** Model used for predicted margins and ranges; its distance is the slant range from the ground antenna. */
  model: { source: 'fit' | 'free-space'; interceptDbm: number; exponent: number; referenceDistanceM: number }
  dropouts: ClassifiedDropout[]
  /** Diversity: signal dropouts each receive antenna alone would have had (same thresholds, no LQ or gaps). */
  antennas: Array<{ index: number; dropoutCount: number; timeInDropoutMs: number }>
  clearance: {
    minFraction: number | null
    samplesBelowRule: number
    shareBelowRule: number | null
    /** Samples below the rule per limiting obstacle label ('ground', 'terrain' or the obstacle label). */
    belowRuleByObstacle: Record<string, number>
    worstKnifeEdgeLossDb: number | null
  }
  summary: {
    durationMs: number
    distanceFlownM: number
    maxDistanceWithLinkM: number | null
    timeWithLinkMs: number
    dropoutCount: number
    dropoutsByCause: Record<DropoutCause, number>
    eirpDbm: number
    fadeMarginDb: number
    /** Where the chosen model meets sensitivity + fade margin, m. */
    predictedRangeM: number | null
    /** Free-space range with the setup's best boresight gain, m. */
    freeSpaceRangeM: number
  }
}

/** What analyseFlight returns. */
export interface FlightAnalysisOutput {
  result: FlightAnalysis
  series: FlightSeries
}
