import { computed, watch } from 'vue'
import { storeToRefs } from 'pinia'
import { beamwidthFromGainDeg } from '@shared/antenna/beamwidth'
import { useFlightDetailStore } from '@/stores/flightDetail'
import { useTimelineStore } from '@/stores/timeline'
import { useUnits } from './useUnits'
import { bestSignal, formatElapsed, nearestIndex } from '@/lib/series'
import { signalDomainFor } from '@/lib/signalScale'
import { beamSectorRing } from '@/lib/beamSector'
import { causeStyle, evidenceText } from '@/lib/dropoutCauses'
import { fresnelProfile } from '@/lib/fresnelProfile'
import { logSpacedM, marginCurve, modelCurve, setupFreeSpaceModel } from '@/lib/modelCurves'
import { summaryCards } from '@/lib/flightSummary'
import { distanceAxisUnit, heightAxisUnit } from '@/lib/axisUnits'
import type { DropoutRow, MapDropout, TimeBand } from '@/lib/flightViewTypes'

/** Everything the flight screen's components draw, derived from the stores in one place. */
export function useFlightScreen() {
  const store = useFlightDetailStore()
  const timeline = useTimelineStore()
  const units = useUnits()
  const { flight, course, setup, samples, dropouts, fadeMarginDb, terrainError } = storeToRefs(store)
  const { currentMs } = storeToRefs(timeline)

  const analysis = computed(() => flight.value?.analysis ?? null)
  const sensitivityDbm = computed(() => setup.value?.sensitivityDbm ?? null)
  const best = computed(() => samples.value.rssi1Dbm.map((v, i) => bestSignal(v, samples.value.rssi2Dbm[i])))
  const domain = computed(() => signalDomainFor(best.value, sensitivityDbm.value))
  const maxDistanceM = computed(() => {
    const a = analysis.value?.distances.maxDistanceM
    return a ?? Math.max(1, ...samples.value.distM.map((d) => d ?? 0))
  })
  const xUnit = computed(() => distanceAxisUnit(maxDistanceM.value, units.system.value))
  const hUnit = computed(() => heightAxisUnit(units.system.value))

  const station = computed(() => (course.value ? { lat: course.value.stationLat, lon: course.value.stationLon } : null))

  const sector = computed(() => {
    const c = course.value
    const ant = setup.value?.rxAntennas.find((a) => a.kind === 'directional' && a.azimuthDeg !== null)
    if (!c || !ant) return null
    const bw = ant.beamwidthDeg ?? beamwidthFromGainDeg(ant.gainDbi)
    return beamSectorRing(c.stationLat, c.stationLon, ant.azimuthDeg!, Math.min(bw, 359), maxDistanceM.value)
  })

  const cursorIndex = computed(() => nearestIndex(samples.value.tMs, currentMs.value))
  const cursorSample = computed(() => {
    const i = cursorIndex.value
    const s = samples.value
    if (i < 0) return null
    return {
      tMs: s.tMs[i]!,
      lat: s.lat[i] ?? null,
      lon: s.lon[i] ?? null,
      altM: s.altM[i] ?? null,
      distM: s.distM[i] ?? null,
      signalDbm: best.value[i] ?? null,
    }
  })
  const cursorLatLon = computed(() => {
    const c = cursorSample.value
    return c && c.lat !== null && c.lon !== null && !(c.lat === 0 && c.lon === 0) ? { lat: c.lat, lon: c.lon } : null
  })
  const readout = computed(() => {
    const c = cursorSample.value
    if (!c) return ''
    const parts = [
      c.distM !== null ? `${units.distance(c.distM)} out` : 'no fix',
      c.altM !== null ? `${units.height(c.altM)} up` : '',
      c.signalDbm !== null ? `${c.signalDbm.toFixed(0)} dBm` : 'no signal',
    ]
    return parts.filter(Boolean).join(' · ')
  })

  function placeOf(tMs: number): { lat: number; lon: number } | null {
    const i = nearestIndex(samples.value.tMs, tMs)
    const a = samples.value.lat[i]
    const o = samples.value.lon[i]
    return a != null && o != null ? { lat: a, lon: o } : null
  }

  const mapDropouts = computed<MapDropout[]>(() =>
    dropouts.value.flatMap((d, index) => {
      const p = placeOf(d.startMs)
      if (!p) return []
      const s = causeStyle(d.cause)
      const text = `${s.label} at ${formatElapsed(d.startMs)}, ${(d.durationMs / 1000).toFixed(1)} s\n${evidenceText(d.evidence, units.distance)}`
      return [{ index, lat: p.lat, lon: p.lon, cause: d.cause, text }]
    }),
  )
  const bands = computed<TimeBand[]>(() =>
    dropouts.value.map((d, index) => ({ index, startMs: d.startMs, endMs: d.endMs, cause: d.cause })),
  )
  const dropoutRows = computed<DropoutRow[]>(() =>
    dropouts.value.map((d, index) => ({
      index,
      startMs: d.startMs,
      durationMs: d.durationMs,
      distanceM: d.evidence.distanceM,
      heightM: d.evidence.heightM,
      cause: d.cause,
      evidence: evidenceText(d.evidence, units.distance),
    })),
  )

  const signalPoints = computed(() => {
    const s = samples.value
    const out: [number, number, number][] = []
    for (let i = 0; i < s.tMs.length; i++) {
      const d = s.distM[i]
      const v = best.value[i]
      if (d != null && v != null && d > 0) out.push([d, v, s.tMs[i]!])
    }
    return out
  })
  const marginPoints = computed(() =>
    sensitivityDbm.value === null ? [] : signalPoints.value.map(([d, v, t]) => [d, v - sensitivityDbm.value!, t] as [number, number, number]),
  )
  const curveDistances = computed(() => logSpacedM(Math.max(5, analysis.value?.distances.minDistanceM ?? 5), maxDistanceM.value * 1.15))
  const signalCurves = computed(() => {
    const out = []
    const a = analysis.value
    if (a?.fit) out.push({ name: `Fitted (n = ${a.fit.exponent.toFixed(2)})`, colour: '#c2410c', dashed: false, data: modelCurve(a.fit, curveDistances.value) })
    if (setup.value) out.push({ name: 'Free space (n = 2)', colour: '#64748b', dashed: true, data: modelCurve(setupFreeSpaceModel(setup.value), curveDistances.value) })
    return out
  })
  const marginCurves = computed(() => {
    const a = analysis.value
    if (!a || sensitivityDbm.value === null) return []
    return [{ name: a.model.source === 'fit' ? 'Predicted (fit)' : 'Predicted (free space)', colour: '#c2410c', dashed: false, data: marginCurve(a.model, curveDistances.value, sensitivityDbm.value) }]
  })
  const signalCursor = computed<[number, number] | null>(() => {
    const c = cursorSample.value
    return c && c.distM !== null && c.signalDbm !== null ? [c.distM, c.signalDbm] : null
  })
  const marginCursor = computed<[number, number] | null>(() =>
    signalCursor.value && sensitivityDbm.value !== null ? [signalCursor.value[0], signalCursor.value[1] - sensitivityDbm.value] : null,
  )

  // the course terrain under the path at the chosen moment (the store debounces and caches per moment)
  watch(
    [cursorLatLon, () => course.value?.hasTerrain],
    ([ll]) => {
      if (ll) store.requestTerrainProfile(ll.lat, ll.lon)
    },
    { immediate: true },
  )
  const pathTerrain = computed(() => {
    const c = course.value
    const ll = cursorLatLon.value
    if (!c?.hasTerrain || !ll) return null
    const t = store.terrainProfileAt(ll.lat, ll.lon)
    return t ? { distanceM: t.distanceM, elevationM: t.elevationM, datumM: c.groundElevM } : null
  })

  const profile = computed(() => {
    const c = course.value
    const s = setup.value
    const at = cursorSample.value
    if (!c || !s || !at || !cursorLatLon.value || at.altM === null) return null
    return fresnelProfile(
      {
        freqMHz: s.freqMHz,
        stationLat: c.stationLat,
        stationLon: c.stationLon,
        antennaHeightM: c.antennaHeightM,
        aircraftLat: cursorLatLon.value.lat,
        aircraftLon: cursorLatLon.value.lon,
        aircraftHeightM: Math.max(0, at.altM),
      },
      c.obstacles,
      120,
      pathTerrain.value,
    )
  })
  const profileMoment = computed(() => {
    const c = cursorSample.value
    return c ? `at ${formatElapsed(c.tMs)}, ${c.distM !== null ? units.distance(c.distM) : '?'} out, ${c.altM !== null ? units.height(c.altM) : '?'} up` : ''
  })
  const flatGroundNote = computed(() => {
    if (!course.value?.hasTerrain) return 'flat ground at the station with earth curvature'
    if (profile.value?.ground === 'terrain') return 'course terrain with earth curvature'
    if (terrainError.value) return `terrain unavailable (${terrainError.value}): ground drawn flat with earth curvature`
    return 'loading the course terrain; ground drawn flat with earth curvature meanwhile'
  })

  const cards = computed(() =>
    analysis.value && sensitivityDbm.value !== null
      ? summaryCards(analysis.value, sensitivityDbm.value, fadeMarginDb.value, (m) => units.distance(m))
      : [],
  )

  return {
    analysis,
    sensitivityDbm,
    domain,
    xUnit,
    hUnit,
    station,
    sector,
    cursorLatLon,
    readout,
    mapDropouts,
    bands,
    dropoutRows,
    signalPoints,
    marginPoints,
    signalCurves,
    marginCurves,
    signalCursor,
    marginCursor,
    profile,
    profileMoment,
    flatGroundNote,
    cards,
    units,
  }
}
