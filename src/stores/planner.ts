import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import type { LinkSetupDto } from '@shared/types/setup'
import type { CourseDto } from '@shared/types/course'
import { planLink, type LinkPlan, type MeasuredModel, type PlanRadio } from '@shared/planning/linkPlan'
import { POWER_LIMIT_PRESETS, presetsForFrequency, type PowerLimit } from '@shared/planning/powerLimits'
import { getFlight, type FlightDto } from '@/api/flights'
import { getSetup, listSetups } from '@/api/setups'
import { getCourse, listCourses } from '@/api/courses'

/** The receive antenna a plan uses from a setup: the strongest one (a diversity pair plans on its better antenna). */
export function radioFromSetup(s: LinkSetupDto): PlanRadio {
  const rx = [...s.rxAntennas].sort((a, b) => b.gainDbi - a.gainDbi)[0]!
  return {
    freqMHz: s.freqMHz,
    txPowerDbm: s.txPowerDbm,
    txGainDbi: s.txAntenna.gainDbi,
    rxGainDbi: rx.gainDbi,
    rxKind: rx.kind,
    rxBeamwidthDeg: rx.kind === 'directional' ? rx.beamwidthDeg : null,
    cableLossDb: s.cableLossDb,
    sensitivityDbm: s.sensitivityDbm,
  }
}

/** A flight's fitted (or fallback) model with the radio terms it was flown with. */
export function measuredFromFlight(f: FlightDto, s: LinkSetupDto): MeasuredModel | null {
  const m = f.analysis?.model
  if (!m || !(m.exponent > 0)) return null
  const r = radioFromSetup(s)
  return {
    interceptDbm: m.interceptDbm,
    exponent: m.exponent,
    referenceDistanceM: m.referenceDistanceM,
    txPowerDbm: r.txPowerDbm,
    txGainDbi: r.txGainDbi,
    rxGainDbi: r.rxGainDbi,
    cableLossDb: r.cableLossDb,
  }
}

/** Plan a link: inputs, the model it starts from, the power-limit preset, and the live plan. */
export const usePlannerStore = defineStore('planner', () => {
  const setups = ref<LinkSetupDto[]>([])
  const courses = ref<CourseDto[]>([])
  const setupId = ref<number | null>(null)
  const courseId = ref<number | null>(null)
  const flight = ref<FlightDto | null>(null)
  const measured = ref<MeasuredModel | null>(null)
  const useFlightModel = ref(false)
  const radio = ref<PlanRadio>({
    freqMHz: 2440, txPowerDbm: 14, txGainDbi: 2, rxGainDbi: 2, rxKind: 'omni', rxBeamwidthDeg: null,
    cableLossDb: 1, sensitivityDbm: -105,
  })
  const fadeMarginDb = ref(10)
  const targetRangeM = ref(2000)
  const tradeDb = ref(10)
  const presetId = ref<string>('eu-2g4')
  const limits = ref<PowerLimit[]>(POWER_LIMIT_PRESETS.find((p) => p.id === 'eu-2g4')!.limits.map((l) => ({ ...l })))

  const preset = computed(() => POWER_LIMIT_PRESETS.find((p) => p.id === presetId.value) ?? null)
  const matchingPresets = computed(() => presetsForFrequency(radio.value.freqMHz))

  const planResult = computed<{ plan: LinkPlan | null; error: string | null }>(() => {
    try {
      const plan = planLink({
        radio: radio.value,
        measured: useFlightModel.value ? measured.value : null,
        fadeMarginDb: fadeMarginDb.value,
        targetRangeM: targetRangeM.value,
        tradeDb: tradeDb.value,
        limits: limits.value,
      })
      return { plan, error: null }
    } catch (e) {
      return { plan: null, error: e instanceof Error ? e.message : String(e) }
    }
  })
  const plan = computed(() => planResult.value.plan)
  const planError = computed(() => planResult.value.error)

  function choosePreset(id: string): void {
    presetId.value = id
    const p = POWER_LIMIT_PRESETS.find((x) => x.id === id)
    if (p) limits.value = p.limits.map((l) => ({ ...l }))
  }

  function applySetup(s: LinkSetupDto): void {
    setupId.value = s.id
    radio.value = radioFromSetup(s)
    const match = presetsForFrequency(s.freqMHz)[0]
    if (match && !match.limits.every((l, i) => limits.value[i]?.maxDbm === l.maxDbm)) choosePreset(match.id)
  }

  async function chooseSetup(id: number): Promise<void> {
    applySetup(setups.value.find((s) => s.id === id) ?? (await getSetup(id)))
  }

  async function loadFlight(id: number): Promise<void> {
    const f = await getFlight(id)
    const s = await getSetup(f.setupId)
    flight.value = f
    measured.value = measuredFromFlight(f, s)
    useFlightModel.value = measured.value !== null
    courseId.value = f.courseId
    applySetup(s)
  }

  /** Loads the pickers and the starting point named by the route's query. */
  async function init(q: { flightId?: number; setupId?: number; courseId?: number }): Promise<void> {
    const [s, c] = await Promise.all([listSetups({ limit: 200 }), listCourses({ limit: 200 })])
    setups.value = s.items
    courses.value = c.items
    if (q.flightId) await loadFlight(q.flightId)
    else {
      flight.value = null
      measured.value = null
      useFlightModel.value = false
    }
    if (q.setupId) await chooseSetup(q.setupId)
    if (q.courseId) courseId.value = q.courseId
    if (courseId.value !== null && !courses.value.some((x) => x.id === courseId.value)) {
      courses.value = [...courses.value, await getCourse(courseId.value)]
    }
  }

  return {
    setups, courses, setupId, courseId, flight, measured, useFlightModel, radio, fadeMarginDb, targetRangeM, tradeDb,
    presetId, limits, preset, matchingPresets, plan, planError, choosePreset, applySetup, chooseSetup, loadFlight, init,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(usePlannerStore, import.meta.hot))
