import { freeSpaceModel, linkMarginAtDistanceDb } from '@shared/propagation/predictions'
import { predictRxPowerDbm, type LogDistanceModel } from '@shared/propagation/logDistanceFit'
import type { LinkSetupDto } from '@shared/types/setup'

/** [distance in metres, value] pairs for a chart line. */
export type CurvePoint = [number, number]

/**
 * Log-spaced distances from near to far, so a curve on a distance axis looks smooth at both ends.
 * @param fromM first distance, > 0
 * @param toM last distance, > fromM
 */
export function logSpacedM(fromM: number, toM: number, count = 64): number[] {
  const a = Math.log10(Math.max(fromM, 0.1))
  const b = Math.log10(Math.max(toM, fromM * 1.01))
  return Array.from({ length: count }, (_, i) => 10 ** (a + ((b - a) * i) / (count - 1)))
}

/** Received power predicted by a model over a distance range. */
export function modelCurve(model: LogDistanceModel, distancesM: readonly number[]): CurvePoint[] {
  return distancesM.map((d) => [d, predictRxPowerDbm(model, d)])
}

/**
 * The free-space model of a setup: conducted power, transmit and best receive gain, minus cable loss, n = 2.
 * Uses the best receive antenna's boresight gain (the best case for a directional one).
 */
export function setupFreeSpaceModel(setup: LinkSetupDto): LogDistanceModel {
  const rxGainDbi = setup.rxAntennas.length ? Math.max(...setup.rxAntennas.map((a) => a.gainDbi)) : 0
  return freeSpaceModel({
    txPowerDbm: setup.txPowerDbm,
    txGainDbi: setup.txAntenna.gainDbi,
    rxGainDbi,
    txLossDb: Math.max(0, setup.cableLossDb),
    rxLossDb: 0,
    freqHz: setup.freqMHz * 1e6,
  })
}

/** Margin above sensitivity predicted by a model over a distance range, dB. */
export function marginCurve(model: LogDistanceModel, distancesM: readonly number[], sensitivityDbm: number): CurvePoint[] {
  return distancesM.map((d) => [d, linkMarginAtDistanceDb(model, d, sensitivityDbm)])
}
