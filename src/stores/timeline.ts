import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'

/** Playback speeds offered, as multiples of real time. */
export const PLAYBACK_SPEEDS = [1, 2, 5, 10, 30, 60] as const

/**
 * The one timeline of the flight screen: the moment every chart and the map point at, and playback.
 * Time is ms from the flight's first sample. Playback is driven from outside by `tick(elapsedMs)`
 * (the screen calls it from requestAnimationFrame), so the store itself never touches a clock.
 */
export const useTimelineStore = defineStore('timeline', () => {
  const startMs = ref(0)
  const endMs = ref(0)
  const currentMs = ref(0)
  const playing = ref(false)
  const speed = ref<number>(10)

  const durationMs = computed(() => endMs.value - startMs.value)
  const fraction = computed(() =>
    durationMs.value > 0 ? (currentMs.value - startMs.value) / durationMs.value : 0,
  )
  const atEnd = computed(() => currentMs.value >= endMs.value)

  function clamp(ms: number): number {
    if (!Number.isFinite(ms)) return currentMs.value
    return Math.min(endMs.value, Math.max(startMs.value, ms))
  }

  /** Sets the flight's span and puts the cursor at its start, stopped. */
  function reset(fromMs: number, toMs: number): void {
    if (!(toMs >= fromMs)) throw new RangeError(`toMs must be >= fromMs, got ${fromMs}…${toMs}`)
    startMs.value = fromMs
    endMs.value = toMs
    currentMs.value = fromMs
    playing.value = false
  }

  /** Moves the cursor (clamped into the flight). */
  function seek(ms: number): void {
    currentMs.value = clamp(ms)
  }

  function play(): void {
    if (durationMs.value <= 0) return
    // pressing play at the end starts over, as a pilot expects
    if (atEnd.value) currentMs.value = startMs.value
    playing.value = true
  }

  function pause(): void {
    playing.value = false
  }

  function toggle(): void {
    if (playing.value) pause()
    else play()
  }

  function setSpeed(multiple: number): void {
    if (!Number.isFinite(multiple) || multiple <= 0) throw new RangeError(`speed must be > 0, got ${multiple}`)
    speed.value = multiple
  }

  /** Advances playback by real elapsed time; stops at the end. No effect while paused. */
  function tick(elapsedMs: number): void {
    if (!playing.value || !(elapsedMs > 0)) return
    currentMs.value = clamp(currentMs.value + elapsedMs * speed.value)
    if (atEnd.value) playing.value = false
  }

  return {
    startMs,
    endMs,
    currentMs,
    playing,
    speed,
    durationMs,
    fraction,
    atEnd,
    reset,
    seek,
    play,
    pause,
    toggle,
    setSpeed,
    tick,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useTimelineStore, import.meta.hot))
