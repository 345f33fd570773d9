import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref, shallowRef } from 'vue'
import type { CourseDto, TerrainProfileDto } from '@shared/types/course'
import type { LinkSetupDto } from '@shared/types/setup'
import * as flightsApi from '@/api/flights'
import type { FlightDetail, SamplesDto } from '@/api/flights'
import { getCourse, getTerrainProfile } from '@/api/courses'
import { getSetup } from '@/api/setups'
import { planSampleRequest, pointsForWidth, type SampleRequest, type TimeWindow } from '@/lib/sampleWindow'
import { emptySamples, spliceWindow } from '@/lib/sampleMerge'
import { useTimelineStore } from './timeline'

/** A prefetch older than this (a navigation that never finished) is not reused, ms. */
const PREFETCH_FRESH_MS = 10_000

/** Terrain samples per Fresnel profile (the API allows up to 512). */
export const TERRAIN_PROFILE_POINTS = 200
/** The terrain profile is asked for once the cursor has rested this long, ms (not on every frame of play). */
export const TERRAIN_PROFILE_DEBOUNCE_MS = 150
/** Terrain profiles kept, one per moment looked at. */
const TERRAIN_CACHE_MAX = 200

/** Cache key of a moment's terrain profile: the aircraft's position to about 0.1 m. */
export function terrainProfileKey(lat: number, lon: number): string {
  return `${lat.toFixed(6)},${lon.toFixed(6)}`
}

/** Default fade margin for predicted range, dB (common practice 10–20). */
export const DEFAULT_FADE_MARGIN_DB = 10

/**
 * The flight screen's data: the flight with its analysis, its course and setup, an overview of the
 * samples and at most one finer window spliced in when the user zooms (a chart or the map).
 */
export const useFlightDetailStore = defineStore('flightDetail', () => {
  const flight = ref<FlightDetail | null>(null)
  const course = ref<CourseDto | null>(null)
  const setup = ref<LinkSetupDto | null>(null)
  // large arrays: shallow, they are replaced whole and never mutated
  const overview = shallowRef<SamplesDto>(emptySamples())
  const detail = shallowRef<SamplesDto | null>(null)
  const detailRequest = ref<SampleRequest | null>(null)
  const overviewRequest = ref<SampleRequest | null>(null)
  const loading = ref(false)
  const refining = ref(false)
  const fadeMarginDb = ref(DEFAULT_FADE_MARGIN_DB)
  const selectedDropout = ref<number | null>(null)
  /** Terrain between the station and the aircraft, per moment (key: terrainProfileKey); replaced whole. */
  const terrainProfiles = shallowRef<ReadonlyMap<string, TerrainProfileDto>>(new Map())
  const terrainError = ref<string | null>(null)
  let terrainTimer: ReturnType<typeof setTimeout> | null = null
  /** Guards against a slow response overwriting a newer one. */
  let requestSeq = 0
  /** Requests started by prefetch() before the screen mounted, taken over by load(). */
  let pending: {
    id: number
    maxPoints: number
    atMs: number
    flight: Promise<FlightDetail>
    overview: Promise<SamplesDto>
    context: Promise<[CourseDto, LinkSetupDto]>
  } | null = null

  const span = computed<TimeWindow>(() => {
    const t = overview.value.tMs
    const dur = flight.value?.analysis?.summary.durationMs
    return { fromMs: t[0] ?? 0, toMs: Math.max(t[t.length - 1] ?? 0, dur ?? 0) }
  })
  const samples = computed(() =>
    spliceWindow(overview.value, detail.value, detailRequest.value),
  )
  const dropouts = computed(() => flight.value?.analysis?.dropouts ?? [])

  /**
   * Starts the flight and overview requests (both at once: the overview does not need the flight first) as soon as
   * the route is known, so they run while the screen's code is still downloading.
   * @param id the flight
   * @param widthPx expected drawing width of the charts
   */
  function prefetch(id: number, widthPx: number): void {
    const maxPoints = pointsForWidth(widthPx)
    const flightReq = flightsApi.getFlight(id)
    const overviewReq = flightsApi.getSamples(id, 0, undefined, maxPoints)
    // the course and setup as soon as the flight names them, not when the screen has mounted
    const contextReq = flightReq.then((f) => Promise.all([getCourse(f.courseId), getSetup(f.setupId)]))
    // load() reports failures; these keep an unawaited rejection quiet meanwhile
    for (const p of [flightReq, overviewReq, contextReq]) p.catch(() => undefined)
    pending = { id, maxPoints, atMs: Date.now(), flight: flightReq, overview: overviewReq, context: contextReq }
  }

  /** Loads everything the screen needs and puts the timeline at the start. */
  async function load(id: number, widthPx: number): Promise<void> {
    loading.value = true
    const seq = ++requestSeq
    try {
      // a fresh prefetch of this flight is taken as it is (its point budget came from a layout estimate)
      if (pending?.id !== id || Date.now() - pending.atMs > PREFETCH_FRESH_MS) prefetch(id, widthPx)
      const { flight: flightReq, overview: overviewPending, context, maxPoints } = pending!
      pending = null
      const [f, [c, s], o] = await Promise.all([flightReq, context, overviewPending])
      if (seq !== requestSeq) return
      const lastMs = o.tMs[o.tMs.length - 1] ?? 0
      const req: SampleRequest = { fromMs: 0, toMs: Math.max(1, lastMs, f.analysis?.summary.durationMs ?? 0), maxPoints }
      flight.value = f
      terrainProfiles.value = new Map()
      course.value = c
      setup.value = s
      overview.value = o
      overviewRequest.value = req
      detail.value = null
      detailRequest.value = null
      selectedDropout.value = null
      useTimelineStore().reset(span.value.fromMs, span.value.toMs)
    } finally {
      if (seq === requestSeq) loading.value = false
    }
  }

  /**
   * Asks for finer samples when the view (a chart's zoom or the map's box) got narrower than the
   * loaded data can show; null view means "back to the whole flight".
   */
  async function refine(view: TimeWindow | null, widthPx: number): Promise<void> {
    const id = flight.value?.id
    if (id === undefined) return
    if (!view) {
      detail.value = null
      detailRequest.value = null
      return
    }
    const loaded = detailRequest.value ?? overviewRequest.value
    const loadedCount = detailRequest.value ? (detail.value?.tMs.length ?? 0) : overview.value.tMs.length
    const req = planSampleRequest(view, widthPx, loaded, span.value, loadedCount)
    if (!req) return
    const seq = ++requestSeq
    refining.value = true
    try {
      const d = await flightsApi.getSamples(id, req.fromMs, req.toMs, req.maxPoints)
      if (seq !== requestSeq) return
      detail.value = d
      detailRequest.value = req
    } finally {
      if (seq === requestSeq) refining.value = false
    }
  }

  /** Moves the timeline to a dropout's start and remembers it as the chosen one. */
  function selectDropout(index: number): void {
    const d = dropouts.value[index]
    if (!d) return
    selectedDropout.value = index
    useTimelineStore().seek(d.startMs)
  }

  /** Queues a fresh analysis (e.g. after the course changed); the screen shows the status it answers. */
  async function reanalyse(): Promise<void> {
    const f = flight.value
    if (!f) return
    const st = await flightsApi.reanalyseFlight(f.id)
    flight.value = { ...f, status: st.status }
  }

  /**
   * Asks (debounced) for the course terrain between the station and the aircraft at the chosen moment, when the
   * course has terrain and the moment is not cached yet; profiles of other flights are dropped on load.
   */
  function requestTerrainProfile(lat: number, lon: number): void {
    if (terrainTimer !== null) clearTimeout(terrainTimer)
    terrainTimer = null
    const c = course.value
    if (!c?.hasTerrain || terrainProfiles.value.has(terrainProfileKey(lat, lon))) return
    terrainTimer = setTimeout(() => {
      terrainTimer = null
      void fetchTerrainProfile(c, lat, lon)
    }, TERRAIN_PROFILE_DEBOUNCE_MS)
  }

  async function fetchTerrainProfile(c: CourseDto, lat: number, lon: number): Promise<void> {
    try {
      const p = await getTerrainProfile(c.id, { lat: c.stationLat, lon: c.stationLon }, { lat, lon }, TERRAIN_PROFILE_POINTS)
      if (course.value?.id !== c.id) return
      const next = new Map(terrainProfiles.value)
      next.set(terrainProfileKey(lat, lon), p)
      if (next.size > TERRAIN_CACHE_MAX) next.delete(next.keys().next().value!)
      terrainProfiles.value = next
      terrainError.value = null
    } catch (e) {
      // the profile falls back to flat ground; the chart says why
      terrainError.value = e instanceof Error ? e.message : String(e)
    }
  }

  /** The cached terrain profile of a moment, or null (not asked for yet, or no terrain). */
  function terrainProfileAt(lat: number, lon: number): TerrainProfileDto | null {
    return terrainProfiles.value.get(terrainProfileKey(lat, lon)) ?? null
  }

  function setFadeMargin(db: number): void {
    if (Number.isFinite(db) && db >= 0 && db <= 40) fadeMarginDb.value = db
  }

  return {
    flight,
    course,
    setup,
    overview,
    detail,
    detailRequest,
    overviewRequest,
    loading,
    refining,
    fadeMarginDb,
    selectedDropout,
    span,
    samples,
    dropouts,
    prefetch,
    load,
    refine,
    selectDropout,
    reanalyse,
    terrainProfiles,
    terrainError,
    requestTerrainProfile,
    terrainProfileAt,
    setFadeMargin,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useFlightDetailStore, import.meta.hot))
