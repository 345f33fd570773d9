import { onBeforeUnmount, ref, type Ref } from 'vue'

/** A reactive boolean that follows a CSS media query, e.g. '(max-width: 1023px)'. */
export function useMediaQuery(query: string): Ref<boolean> {
  const mql = typeof window !== 'undefined' && window.matchMedia ? window.matchMedia(query) : null
  const matches = ref(mql?.matches ?? false)
  const update = (e: MediaQueryListEvent) => (matches.value = e.matches)
  mql?.addEventListener('change', update)
  onBeforeUnmount(() => mql?.removeEventListener('change', update))
  return matches
}
