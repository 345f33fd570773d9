import { requireFinite, requireNonNegative } from '../units/guards.js'
import {
  freeSpaceDistanceForLossM,
  freeSpaceDistanceForLossPracticalM,
  freeSpaceLossDb,
} from './freeSpaceLoss.js'

/** The fixed terms of a one-way radio link, all in dB units. */
export interface LinkBudget {
  /** Conducted transmit power at the transmitter port, dBm. */
  txPowerDbm: number
  /** Transmit antenna gain, dBi. */
  txGainDbi: number
  /** Receive antenna gain toward the other end (already reduced off boresight), dBi. */
  rxGainDbi: number
  /** Cable and connector loss on the transmit side, dB (>= 0). */
  txLossDb: number
  /** Cable and connector loss on the receive side, dB (>= 0). */
  rxLossDb: number
  /** Carrier frequency, Hz. */
  freqHz: number
}

function checkBudget(b: LinkBudget): void {
  requireFinite('txPowerDbm', b.txPowerDbm)
  requireFinite('txGainDbi', b.txGainDbi)
  requireFinite('rxGainDbi', b.rxGainDbi)
  requireNonNegative('txLossDb', b.txLossDb)
  requireNonNegative('rxLossDb', b.rxLossDb)
}

/** Pt + Gt + Gr − Ltx − Lrx: everything in the budget but the path loss, dBm. */
function netPowerDbm(b: LinkBudget): number {
  return b.txPowerDbm + b.txGainDbi + b.rxGainDbi - b.txLossDb - b.rxLossDb
}

/**
 * Effective isotropic radiated power.
 * @param txPowerDbm conducted transmit power in dBm, finite
 * @param txGainDbi transmit antenna gain in dBi, finite
 * @param txLossDb transmit-side cable/connector loss in dB, >= 0
 * @returns EIRP in dBm
 * @throws RangeError when a value is not finite or txLossDb < 0
 */
export function eirpDbm(txPowerDbm: number, txGainDbi: number, txLossDb = 0): number {
  requireFinite('txPowerDbm', txPowerDbm)
  requireFinite('txGainDbi', txGainDbi)
  requireNonNegative('txLossDb', txLossDb)
  // EIRP = Pt + Gt − Ltx (link-budget bookkeeping, e.g. Rappaport §4.2)
  return txPowerDbm + txGainDbi - txLossDb
}

/**
 * Received power in free space (Friis).
 * @param budget link terms; gains in dBi, losses in dB (>= 0), freqHz > 0
 * @param distanceM path length in metres, > 0
 * @returns received power in dBm
 * @throws RangeError when a budget term or the distance is out of range
 */
export function receivedPowerDbm(budget: LinkBudget, distanceM: number): number {
  checkBudget(budget)
  // Friis (Proc. IRE 34, 1946) in dB: Pr = Pt + Gt + Gr − Ltx − Lrx − FSPL(d)
  return netPowerDbm(budget) - freeSpaceLossDb(distanceM, budget.freqHz)
}

/**
 * Free-space link margin: received power above receiver sensitivity.
 * @param budget link terms; gains in dBi, losses in dB (>= 0), freqHz > 0
 * @param distanceM path length in metres, > 0
 * @param sensitivityDbm receiver sensitivity in dBm, finite
 * @returns margin in dB (negative when below sensitivity)
 * @throws RangeError when a value is out of range
 */
export function freeSpaceMarginDb(budget: LinkBudget, distanceM: number, sensitivityDbm: number): number {
  requireFinite('sensitivityDbm', sensitivityDbm)
  return receivedPowerDbm(budget, distanceM) - sensitivityDbm
}

/**
 * Largest path loss the link tolerates while keeping the fade margin.
 * @param budget link terms; gains in dBi, losses in dB (>= 0)
 * @param sensitivityDbm receiver sensitivity in dBm, finite
 * @param fadeMarginDb margin kept above sensitivity in dB, >= 0
 * @returns allowed path loss in dB
 * @throws RangeError when a value is out of range
 */
export function allowedPathLossDb(budget: LinkBudget, sensitivityDbm: number, fadeMarginDb: number): number {
  checkBudget(budget)
  requireFinite('sensitivityDbm', sensitivityDbm)
  requireNonNegative('fadeMarginDb', fadeMarginDb)
  // Lmax = Pt + Gt + Gr − Lcables − (S + FM), link-budget bookkeeping
  return netPowerDbm(budget) - (sensitivityDbm + fadeMarginDb)
}

/**
 * Free-space range at which the link meets sensitivity plus fade margin (exact FSPL).
 * @param budget link terms; gains in dBi, losses in dB (>= 0), freqHz > 0
 * @param sensitivityDbm receiver sensitivity in dBm, finite
 * @param fadeMarginDb margin kept above sensitivity in dB, >= 0
 * @returns range in metres, > 0
 * @throws RangeError when a value is out of range
 */
export function freeSpaceRangeM(budget: LinkBudget, sensitivityDbm: number, fadeMarginDb: number): number {
  // solve FSPL(d) = Lmax with the exact form of ITU-R P.525
  return freeSpaceDistanceForLossM(allowedPathLossDb(budget, sensitivityDbm, fadeMarginDb), budget.freqHz)
}

/**
 * Free-space range at which the link meets sensitivity plus fade margin (32.45 practical form).
 * @param budget link terms; gains in dBi, losses in dB (>= 0), freqHz > 0
 * @param sensitivityDbm receiver sensitivity in dBm, finite
 * @param fadeMarginDb margin kept above sensitivity in dB, >= 0
 * @returns range in metres, > 0
 * @throws RangeError when a value is out of range
 */
export function freeSpaceRangePracticalM(
  budget: LinkBudget,
  sensitivityDbm: number,
  fadeMarginDb: number,
): number {
  // solve the P.525 practical form for d
  return freeSpaceDistanceForLossPracticalM(
    allowedPathLossDb(budget, sensitivityDbm, fadeMarginDb),
    budget.freqHz,
  )
}
