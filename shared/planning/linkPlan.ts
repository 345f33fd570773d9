import { beamWidthAtDistanceM, beamwidthFromGainDeg } from '../antenna/beamwidth.js'
import { type LogDistanceModel } from '../propagation/logDistanceFit.js'
import {
  equivalentTxPowerMw,
  freeSpaceModel,
  linkMarginAtDistanceDb,
  predictedRangeM,
  rangeFactor,
  txPowerForRangeDbm,
} from '../propagation/predictions.js'
import { setupEirpDbm } from '../setup/derive.js'
import { dbmToMw, mwToDbm } from '../units/power.js'
import { requireFinite, requireNonNegative, requirePositive } from '../units/guards.js'
import { checkPowerLimits, type LimitCheck, type PowerLimit } from './powerLimits.js'

/** The radio being planned. */
export interface PlanRadio {
  freqMHz: number
  txPowerDbm: number
  txGainDbi: number
  /** Receive antenna gain on boresight, dBi. */
  rxGainDbi: number
  rxKind: 'omni' | 'directional'
  /** Half-power beamwidth of a directional receive antenna, degrees; null = estimate from the gain. */
  rxBeamwidthDeg: number | null
  /** Cable and connector losses, both sides, dB (>= 0). */
  cableLossDb: number
  sensitivityDbm: number
}

/** A flight's fitted model and the radio terms it was measured with. */
export interface MeasuredModel extends LogDistanceModel {
  txPowerDbm: number
  txGainDbi: number
  rxGainDbi: number
  cableLossDb: number
}

/** Everything the planner needs. */
export interface PlanInput {
  radio: PlanRadio
  /** A flight's model, or null to plan in free space (n = 2). */
  measured: MeasuredModel | null
  /** Margin kept above sensitivity, dB (>= 0). */
  fadeMarginDb: number
  /** Distance the link must reach, m (> 0). */
  targetRangeM: number
  /** Size of the "antenna gain or power" trade, dB (default 10). */
  tradeDb?: number
  /** Limits of the chosen preset, or null for none. */
  limits: readonly PowerLimit[] | null
}

/** One side of the "more antenna gain or more power" trade. */
export interface TradeOption {
  txPowerDbm: number
  txPowerMw: number
  rxGainDbi: number
  eirpDbm: number
  rangeM: number
  limitChecks: LimitCheck[]
  exceedsLimit: boolean
  /** Receive beam of this option (directional or made directional by the extra gain). */
  beamwidthDeg: number | null
  beamWidthAtTargetM: number | null
}

/** Live answers of the planner. */
export interface LinkPlan {
  modelSource: 'flight' | 'free-space'
  model: LogDistanceModel
  txPowerMw: number
  eirpDbm: number
  /** Where the model meets sensitivity + fade margin, m. */
  rangeM: number
  /** Predicted margin above sensitivity at the target, dB. */
  marginAtTargetDb: number
  meetsFadeMarginAtTarget: boolean
  /** Transmit power that keeps the fade margin at the target, dBm and mW. */
  txPowerForTargetDbm: number
  txPowerForTargetMw: number
  tradeDb: number
  /** Range multiplier of the trade under the model's exponent. */
  tradeRangeFactor: number
  withGain: TradeOption
  withPower: TradeOption
  /** Receive beam at the target for a directional antenna, else null. */
  beam: { beamwidthDeg: number; estimated: boolean; widthAtTargetM: number } | null
  limitChecks: LimitCheck[]
  exceedsLimit: boolean
}

function planModel(input: PlanInput): LogDistanceModel {
  const r = input.radio
  if (!input.measured) {
    return freeSpaceModel({
      txPowerDbm: r.txPowerDbm,
      txGainDbi: r.txGainDbi,
      rxGainDbi: r.rxGainDbi,
      txLossDb: r.cableLossDb,
      rxLossDb: 0,
      freqHz: r.freqMHz * 1e6,
    })
  }
  const m = input.measured
  // the measured intercept moves dB for dB with every budget term (link-budget bookkeeping)
  const shiftDb =
    r.txPowerDbm + r.txGainDbi + r.rxGainDbi - r.cableLossDb -
    (m.txPowerDbm + m.txGainDbi + m.rxGainDbi - m.cableLossDb)
  return { interceptDbm: m.interceptDbm + shiftDb, exponent: m.exponent, referenceDistanceM: m.referenceDistanceM }
}

function tradeOption(
  input: PlanInput,
  txPowerDbm: number,
  rxGainDbi: number,
  rangeM: number,
  directional: boolean,
): TradeOption {
  const eirp = setupEirpDbm(txPowerDbm, input.radio.txGainDbi)
  const checks = input.limits ? checkPowerLimits(input.limits, txPowerDbm, eirp) : []
  const bw = directional ? (input.radio.rxBeamwidthDeg !== null && rxGainDbi === input.radio.rxGainDbi
    ? input.radio.rxBeamwidthDeg
    : beamwidthFromGainDeg(rxGainDbi)) : null
  const usableBw = bw !== null && bw < 180 ? bw : null
  return {
    txPowerDbm,
    txPowerMw: dbmToMw(txPowerDbm),
    rxGainDbi,
    eirpDbm: eirp,
    rangeM,
    limitChecks: checks,
    exceedsLimit: checks.some((c) => c.exceeded),
    beamwidthDeg: usableBw,
    beamWidthAtTargetM: usableBw === null ? null : beamWidthAtDistanceM(input.targetRangeM, usableBw),
  }
}

/**
 * Plans a link from a flight's fitted model (shifted by the changed budget terms) or from free space:
 * range at sensitivity + fade margin, margin at a target distance, power needed for the target, the
 * "antenna gain or power" trade, the receive beam's width at the target, and EIRP against a preset.
 * @param input radio (MHz, dBm, dBi, dB), measured model or null, fade margin (dB), target (m), trade (dB), limits
 * @returns the plan's figures
 * @throws RangeError when an input is out of range
 */
export function planLink(input: PlanInput): LinkPlan {
  const r = input.radio
  requirePositive('radio.freqMHz', r.freqMHz)
  requireFinite('radio.txPowerDbm', r.txPowerDbm)
  requireNonNegative('radio.cableLossDb', r.cableLossDb)
  requireFinite('radio.sensitivityDbm', r.sensitivityDbm)
  const fm = requireNonNegative('fadeMarginDb', input.fadeMarginDb)
  const target = requirePositive('targetRangeM', input.targetRangeM)
  const tradeDb = requireFinite('tradeDb', input.tradeDb ?? 10)
  const model = planModel(input)
  const rangeM = predictedRangeM(model, r.sensitivityDbm, fm)
  const marginAtTargetDb = linkMarginAtDistanceDb(model, target, r.sensitivityDbm)
  const txForTarget = txPowerForRangeDbm(model, r.txPowerDbm, target, r.sensitivityDbm, fm)
  const factor = rangeFactor(tradeDb, model.exponent)
  const eirp = setupEirpDbm(r.txPowerDbm, r.txGainDbi)
  const limitChecks = input.limits ? checkPowerLimits(input.limits, r.txPowerDbm, eirp) : []
  const directional = r.rxKind === 'directional'
  const beamwidthDeg = directional ? (r.rxBeamwidthDeg ?? beamwidthFromGainDeg(r.rxGainDbi)) : null
  return {
    modelSource: input.measured ? 'flight' : 'free-space',
    model,
    txPowerMw: dbmToMw(r.txPowerDbm),
    eirpDbm: eirp,
    rangeM,
    marginAtTargetDb,
    meetsFadeMarginAtTarget: marginAtTargetDb >= fm,
    txPowerForTargetDbm: txForTarget,
    txPowerForTargetMw: dbmToMw(txForTarget),
    tradeDb,
    tradeRangeFactor: factor,
    // extra receive gain narrows the beam, so the gain option is always shown as directional
    withGain: tradeOption(input, r.txPowerDbm, r.rxGainDbi + tradeDb, rangeM * factor, directional || tradeDb > 0),
    withPower: tradeOption(
      input,
      mwToDbm(equivalentTxPowerMw(dbmToMw(r.txPowerDbm), tradeDb)),
      r.rxGainDbi,
      rangeM * factor,
      directional,
    ),
    beam:
      beamwidthDeg !== null && beamwidthDeg < 180
        ? {
            beamwidthDeg,
            estimated: r.rxBeamwidthDeg === null,
            widthAtTargetM: beamWidthAtDistanceM(target, beamwidthDeg),
          }
        : null,
    limitChecks,
    exceedsLimit: limitChecks.some((c) => c.exceeded),
  }
}
