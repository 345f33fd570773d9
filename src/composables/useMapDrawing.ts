import { computed, ref } from 'vue'
import type { LonLat, ObstacleKind } from '@shared/types/course'

/** What a click on the course map does. */
export type DrawMode = 'none' | 'station' | 'route' | ObstacleKind

/** Points needed before a drawing can be finished. */
export const MIN_POINTS: Record<Exclude<DrawMode, 'none' | 'station'>, number> = {
  point: 1,
  route: 2,
  line: 2,
  polygon: 3,
}

/** A finished drawing: a station position, a route, or an obstacle shape waiting for its label and height. */
export type DrawResult =
  | { mode: 'station'; lat: number; lon: number }
  | { mode: 'route'; coordinates: LonLat[] }
  | { mode: ObstacleKind; coordinates: LonLat[] }

/**
 * Applies one map click to a drawing. Station and point finish at once; route, line and polygon
 * collect points until finished.
 * @returns the new draft points and, when the click completed the drawing, its result
 */
export function drawClick(mode: DrawMode, draft: LonLat[], lat: number, lon: number): { draft: LonLat[]; done: DrawResult | null } {
  const p: LonLat = [lon, lat]
  if (mode === 'none') return { draft, done: null }
  if (mode === 'station') return { draft: [], done: { mode: 'station', lat, lon } }
  if (mode === 'point') return { draft: [], done: { mode: 'point', coordinates: [p] } }
  return { draft: [...draft, p], done: null }
}

/**
 * Finishes a multi-point drawing.
 * @returns the result, or null while there are too few points for the mode
 */
export function finishDraw(mode: DrawMode, draft: LonLat[]): DrawResult | null {
  if (mode === 'route' || mode === 'line' || mode === 'polygon') {
    if (draft.length < MIN_POINTS[mode]) return null
    return { mode, coordinates: [...draft] }
  }
  return null
}

/** Reactive drawing state for a map editor: mode, draft points, click and finish. */
export function useMapDrawing(onDone: (r: DrawResult) => void) {
  const mode = ref<DrawMode>('none')
  const draft = ref<LonLat[]>([])
  const canFinish = computed(() => finishDraw(mode.value, draft.value) !== null)

  function start(m: DrawMode): void {
    mode.value = m
    draft.value = []
  }
  function cancel(): void {
    start('none')
  }
  function click(lat: number, lon: number): void {
    const r = drawClick(mode.value, draft.value, lat, lon)
    draft.value = r.draft
    if (r.done) {
      mode.value = 'none'
      onDone(r.done)
    }
  }
  function finish(): void {
    const r = finishDraw(mode.value, draft.value)
    if (!r) return
    cancel()
    onDone(r)
  }
  function undo(): void {
    draft.value = draft.value.slice(0, -1)
  }
  return { mode, draft, canFinish, start, cancel, click, finish, undo }
}
