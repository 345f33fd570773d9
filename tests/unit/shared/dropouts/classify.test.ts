import { describe, expect, it } from 'vitest'
import { classifyDropout, type DropoutContext } from '../../../../shared/dropouts/classify.js'
import { type DetectedDropout } from '../../../../shared/dropouts/detect.js'
import { twoRayNullDistanceM } from '../../../../shared/propagation/twoRay.js'
import { wavelengthM } from '../../../../shared/rf/wavelength.js'

const N = 40
const lambda = wavelengthM(5.8e9)

/** A steady flight 800 m out at 30 m, strong signal, clear path, on boresight, model margin 25 dB. */
function context(): DropoutContext & { pointingLossDb: Float64Array } {
  return {
    timeMs: Float64Array.from({ length: N }, (_, i) => i * 100),
    rxPowerDbm: new Float64Array(N).fill(-70),
    distanceM: new Float64Array(N).fill(800),
    altitudeM: new Float64Array(N).fill(430),
    altitudeOffsetM: 400,
    clearanceFraction: new Float64Array(N).fill(1),
    limitingObstacle: new Int32Array(N).fill(-3),
    obstacleLabels: ['barn'],
    pointingLossDb: new Float64Array(N),
    predictedMarginDb: new Float64Array(N).fill(25),
    antennaHeightM: 1.5,
    wavelengthM: lambda,
    sensitivityDbm: -95,
  }
}

function event(i0: number, i1: number, extra: Partial<DetectedDropout> = {}): DetectedDropout {
  return { startIndex: i0, endIndex: i1, startMs: i0 * 100, endMs: (i1 + 1) * 100, durationMs: (i1 + 1 - i0) * 100, fromSignal: true, fromLinkQuality: false, fromGap: false, ...extra }
}

describe('classifyDropout', () => {
  it('blames an obstacle when F1 clearance falls below 60 % (common practice)', () => {
    const ctx = context()
    ctx.clearanceFraction.fill(0.2, 20, 25)
    ctx.limitingObstacle.fill(0, 20, 25)
    const d = classifyDropout(event(21, 23), ctx, { fadeMarginDb: 10 })
    expect(d.cause).toBe('obstruction')
    expect(d.evidence).toMatchObject({ limitingObstacle: 'barn', minClearanceFraction: 0.2 })
  })
  it('blames the beam when pointing costs 3 dB or more', () => {
    const ctx = context()
    ctx.pointingLossDb.fill(8, 20, 25)
    expect(classifyDropout(event(20, 22), ctx, { fadeMarginDb: 10 }).cause).toBe('beam')
  })
  it('blames range when the model leaves less than the fade margin', () => {
    const ctx = context()
    ctx.predictedMarginDb = new Float64Array(N).fill(4)
    ctx.rxPowerDbm.fill(-92)
    const d = classifyDropout(event(20, 22), ctx, { fadeMarginDb: 10 })
    expect(d.cause).toBe('range')
    expect(d.evidence.predictedMarginDb).toBe(4)
  })
  it('calls a sudden fade with margin to spare a reflection', () => {
    const ctx = context()
    ctx.rxPowerDbm.fill(-120, 20, 23)
    const d = classifyDropout(event(20, 22), ctx, { fadeMarginDb: 10 })
    expect(d.cause).toBe('reflection')
    expect(d.evidence.suddenFade).toBe(true)
  })
  it('marks a dropout at a two-ray null distance as near the null', () => {
    const ctx = context()
    const dNull = twoRayNullDistanceM(1, 5.8e9, 1.5, 30)
    ctx.distanceM.fill(dNull)
    ctx.rxPowerDbm.fill(-90)
    const d = classifyDropout(event(20, 22), ctx, { fadeMarginDb: 10 })
    expect(d.evidence.nearNull).toBe(true)
    expect(d.evidence.nearestNullM).toBeCloseTo(dNull, 6)
    expect(d.evidence.heightM).toBe(30)
    expect(d.cause).toBe('reflection')
  })
  it('calls a bare telemetry gap with nothing else wrong a gap', () =>
    expect(classifyDropout(event(20, 21, { fromSignal: false, fromGap: true }), context(), { fadeMarginDb: 10 }).cause).toBe('gap'))
  it('calls a gap-only event a gap even where the path is obstructed, keeping the obstruction as a further cause', () => {
    const ctx = context()
    ctx.clearanceFraction.fill(0.5, 20, 22)
    ctx.limitingObstacle.fill(0, 20, 22)
    const d = classifyDropout(event(20, 21, { fromSignal: false, fromGap: true }), ctx, { fadeMarginDb: 10 })
    expect(d.cause).toBe('gap')
    expect(d.causes).toEqual(['gap', 'obstruction'])
    expect(d.evidence).toMatchObject({ minClearanceFraction: 0.5, limitingObstacle: 'barn', signalBeforeDbm: null })
  })
  it('keeps the signal cause first when a gap merged with a fade below sensitivity', () => {
    const ctx = context()
    ctx.clearanceFraction.fill(0.5, 20, 22)
    const d = classifyDropout(event(20, 21, { fromSignal: true, fromGap: true }), ctx, { fadeMarginDb: 10 })
    expect(d.causes[0]).toBe('obstruction')
    expect(d.causes).toContain('gap')
  })
  it('leaves a slow decay with margin and no geometry cause unexplained', () => {
    const ctx = context()
    ctx.rxPowerDbm.fill(-90)
    ctx.distanceM.fill(2900)
    expect(classifyDropout(event(20, 22), ctx, { fadeMarginDb: 10 }).cause).toBe('unexplained')
  })
  it('accepts the predicted margin as a function of the sample index', () => {
    const ctx = context()
    ctx.predictedMarginDb = (i: number) => (i >= 20 ? 3 : 25)
    expect(classifyDropout(event(20, 22), ctx, { fadeMarginDb: 10 }).evidence.predictedMarginDb).toBe(3)
  })
  it('lists every matching cause in preference order', () => {
    const ctx = context()
    ctx.clearanceFraction.fill(0.1)
    ctx.pointingLossDb.fill(10)
    ctx.predictedMarginDb = new Float64Array(N).fill(0)
    expect(classifyDropout(event(20, 22), ctx, { fadeMarginDb: 10 }).causes).toEqual(['obstruction', 'beam', 'range'])
  })
  it('rejects indices outside the arrays', () =>
    expect(() => classifyDropout(event(39, 45), context(), { fadeMarginDb: 10 })).toThrow(/endIndex/))
})
