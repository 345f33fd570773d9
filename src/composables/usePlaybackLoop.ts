import { onBeforeUnmount, watch } from 'vue'
import { storeToRefs } from 'pinia'
import { useTimelineStore } from '@/stores/timeline'

/** Drives the timeline store from requestAnimationFrame while it plays; stops on unmount. */
export function usePlaybackLoop(): void {
  const timeline = useTimelineStore()
  const { playing } = storeToRefs(timeline)
  let frame = 0
  let last = 0

  function step(now: number): void {
    if (last) timeline.tick(now - last)
    last = now
    frame = playing.value ? requestAnimationFrame(step) : 0
  }

  function stop(): void {
    if (frame) cancelAnimationFrame(frame)
    frame = 0
    last = 0
  }

  watch(playing, (on) => {
    stop()
    if (on) frame = requestAnimationFrame(step)
  })
  onBeforeUnmount(stop)
}
