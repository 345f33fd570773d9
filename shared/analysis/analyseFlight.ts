import { requireNonNegative, requirePositive } from '../units/guards.js'
import { wavelengthM } from '../rf/wavelength.js'
import { eirpDbm, freeSpaceRangeM, type LinkBudget } from '../rf/linkBudget.js'
import { STANDARD_K_FACTOR } from '../geo/slant.js'
import { prepareObstacles } from '../fresnel/obstacles.js'
import { DEFAULT_FIT_SELECTION_RULE } from '../propagation/fitSelection.js'
import { fitLogDistanceFromSums, type LogDistanceFit } from '../propagation/logDistanceFit.js'
import { freeSpaceModel, predictedRangeM } from '../propagation/predictions.js'
import { detectDropouts, signalDropoutTotals } from '../dropouts/detect.js'
import { classifyDropout } from '../dropouts/classify.js'
import { validateFlightInput } from './validateInput.js'
import { computeGeometry } from './geometryPass.js'
import { createTerrainProbe } from './clearancePass.js'
import { linkPass } from './linkPass.js'
import { EARTH_RADIUS_M } from '../geo/slant.js'
import { countByCause, summariseClearance, summariseDistances } from './summary.js'
import { type AnalysisOptions, type FlightAnalysisOutput, type FlightInput } from './types.js'

/** Version of the analysis method; stored with results so old analyses can be told apart. */
export const METHOD_VERSION = 'ellipsoid-link/1.1.0'

/**
 * Analyses one range-test flight: distances, Fresnel clearance, dropouts with causes, log-distance fit and summary.
 * Distances: the fit, predicted margins and predicted range use the 3-D slant range from the ground antenna to the
 * aircraft (the path the signal travels; ground distance biases the exponent up close in, where the aircraft is
 * high relative to its distance). Ground distance is what is shown (series.distanceM, evidence, max distance with
 * link) and what the fit's minimum-distance rule tests (it guards against the antenna's overhead null).
 * @param input typed-array telemetry, ground station, altitude reference, radio setup, obstacles, optional terrain
 * @param options fade margin (dB, >= 0, default 10), k-factor (> 0, default 4/3), fit/detection/classification rules
 * @returns JSON-safe result and per-sample typed arrays
 * @throws RangeError/TypeError naming the first invalid input field or option
 */
export function analyseFlight(input: FlightInput, options: AnalysisOptions = {}): FlightAnalysisOutput {
  const antennas = validateFlightInput(input)
  const fadeMarginDb = requireNonNegative('options.fadeMarginDb', options.fadeMarginDb ?? 10)
  const kFactor = requirePositive('options.kFactor', options.kFactor ?? STANDARD_K_FACTOR)
  const { samples, station, setup } = input
  const len = samples.timeMs.length
  const freqHz = setup.freqMHz * 1e6
  const lambda = wavelengthM(freqHz)
  const floorDbm = setup.floorDbm ?? null

  const twoKR = 2 * kFactor * EARTH_RADIUS_M
  const prep = prepareObstacles(input.obstacles ?? [], { latDeg: station.latDeg, lonDeg: station.lonDeg }, station.groundElevM)
  const terrain = input.terrain ? createTerrainProbe(input.terrain, station, lambda, twoKR) : null
  const geo = computeGeometry(input, antennas, prep, lambda, twoKR, terrain)

  const detection = detectDropouts(samples.timeMs, geo.rxBestDbm, samples.lqPct, {
    ...options.detection,
    sensitivityDbm: setup.sensitivityDbm,
    floorDbm,
  })

  // per antenna: what each diversity branch alone would have lost (the link itself uses the best one)
  const antennaSeries = samples.rssi2Dbm ? [samples.rssiDbm, samples.rssi2Dbm] : [samples.rssiDbm]
  const perAntenna = antennaSeries.map((series, index) => {
    if (!samples.rssi2Dbm) {
      let timeInDropoutMs = 0
      for (const e of detection.events) timeInDropoutMs += e.durationMs
      return { index, dropoutCount: detection.events.length, timeInDropoutMs }
    }
    // link quality and telemetry gaps belong to the link, not to one antenna: signal only here
    const { count, totalMs } = signalDropoutTotals(samples.timeMs, series, {
      ...options.detection,
      sensitivityDbm: setup.sensitivityDbm,
      floorDbm,
    })
    return { index, dropoutCount: count, timeInDropoutMs: totalMs }
  })

  const rule = { ...DEFAULT_FIT_SELECTION_RULE, floorDbm, ...options.fitSelection }
  // selection, fit sums and time/distance with link in one pass (same results as selectFitSamples + fitLogDistanceFromLog10)
  const pass = linkPass(geo, samples.timeMs, detection.inDropout, rule, detection.gapThresholdMs)
  let fit: LogDistanceFit | null = null
  let fitError: string | null = null
  try {
    const fitOptions = { referenceDistanceM: options.referenceDistanceM ?? 1 }
    if (pass.invalid !== null) {
      // the option error first, as the array fit reports it
      requirePositive('referenceDistanceM', fitOptions.referenceDistanceM)
      throw new RangeError(pass.invalid)
    }
    fit = fitLogDistanceFromSums(pass.sums, fitOptions)
  } catch (e) {
    // too few usable samples is a normal outcome for a short flight: report it, fall back to free space
    fitError = e instanceof Error ? e.message : String(e)
  }
  const budget: LinkBudget = {
    txPowerDbm: setup.txPowerDbm,
    txGainDbi: setup.txGainDbi,
    rxGainDbi: antennas.maxGainDbi,
    txLossDb: 0,
    rxLossDb: setup.cableLossDb,
    freqHz,
  }
  const model = fit ?? freeSpaceModel(budget)
  const source = fit ? 'fit' : 'free-space'

  // predicted margin is needed only at dropout onsets, so it is computed there, not per sample;
  // free space does not know the pointing loss, so it is subtracted there
  const tenN = 10 * model.exponent
  const offset = model.interceptDbm + tenN * Math.log10(model.referenceDistanceM) - setup.sensitivityDbm
  const pointingWeight = fit ? 0 : 1
  const { log10SlantRangeM, pointingLossDb, rxBestDbm } = geo
  const predictedMarginDb = (i: number): number =>
    offset - tenN * log10SlantRangeM[i]! - (pointingWeight === 0 ? 0 : pointingLossDb(i))
  // the measured margin series is built on first read: the stored analysis does not use it
  let marginDb: Float32Array | null = null
  const sensitivityDbm = setup.sensitivityDbm
  const measuredMarginDb = (): Float32Array => {
    if (marginDb === null) {
      marginDb = new Float32Array(len)
      for (let i = 0; i < len; i++) marginDb[i] = rxBestDbm[i]! - sensitivityDbm
    }
    return marginDb
  }
  const { timeWithLinkMs, maxDistanceWithLinkM } = pass

  const ctx = {
    timeMs: samples.timeMs,
    rxPowerDbm: geo.rxBestDbm,
    distanceM: geo.distanceM,
    altitudeM: samples.altM,
    altitudeOffsetM: geo.altitudeOffsetM,
    clearanceFraction: geo.clearanceFraction,
    limitingObstacle: geo.limitingObstacle,
    obstacleLabels: prep.labels,
    pointingLossDb: geo.pointingLossDb,
    predictedMarginDb,
    antennaHeightM: station.antennaHeightM,
    wavelengthM: lambda,
    sensitivityDbm: setup.sensitivityDbm,
  }
  const dropouts = detection.events.map((e) => classifyDropout(e, ctx, { ...options.classification, fadeMarginDb }))
  const predicted = model.exponent > 0 ? predictedRangeM(model, setup.sensitivityDbm, fadeMarginDb) : NaN

  return {
    result: {
      methodVersion: METHOD_VERSION,
      sampleCount: len,
      validFixCount: geo.validFixCount,
      distances: summariseDistances(geo),
      fit,
      fitError,
      fitSelection: { rule: { ...rule }, includedCount: pass.includedCount, excluded: pass.excluded },
      model: { source, interceptDbm: model.interceptDbm, exponent: model.exponent, referenceDistanceM: model.referenceDistanceM },
      dropouts,
      antennas: perAntenna,
      clearance: summariseClearance(geo, prep.labels),
      summary: {
        durationMs: len > 0 ? samples.timeMs[len - 1]! - samples.timeMs[0]! : 0,
        distanceFlownM: geo.distanceFlownM,
        maxDistanceWithLinkM: Number.isFinite(maxDistanceWithLinkM) ? maxDistanceWithLinkM : null,
        timeWithLinkMs,
        dropoutCount: dropouts.length,
        dropoutsByCause: countByCause(dropouts),
        eirpDbm: eirpDbm(setup.txPowerDbm, setup.txGainDbi, 0),
        fadeMarginDb,
        predictedRangeM: Number.isFinite(predicted) ? predicted : null,
        freeSpaceRangeM: freeSpaceRangeM(budget, setup.sensitivityDbm, fadeMarginDb),
      },
    },
    series: {
      distanceM: geo.distanceM,
      clearanceFraction: geo.clearanceFraction,
      get marginDb() {
        return measuredMarginDb()
      },
      rxBestDbm: geo.rxBestDbm,
      inDropout: detection.inDropout,
    },
  }
}
