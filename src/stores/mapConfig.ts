import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import * as configApi from '@/api/config'

/** The local graticule tiles: the fallback while the config loads or when it cannot be read. */
export const LOCAL_TILE_URL = '/tiles/{z}/{x}/{y}.png'

export const useMapConfigStore = defineStore('mapConfig', () => {
  const tileUrl = ref(LOCAL_TILE_URL)
  const attribution = ref('')
  const loaded = ref(false)
  let pending: Promise<void> | null = null

  /** Loads the tile source once; on failure the local tiles stay. */
  function ensureLoaded(): Promise<void> {
    pending ??= configApi
      .getMapConfig()
      .then((c) => {
        tileUrl.value = c.tileUrl
        attribution.value = c.attribution
      })
      .catch(() => undefined)
      .finally(() => (loaded.value = true))
    return pending
  }

  return { tileUrl, attribution, loaded, ensureLoaded }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useMapConfigStore, import.meta.hot))
