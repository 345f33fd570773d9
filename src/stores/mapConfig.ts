import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import { getMapConfig, type MapConfigDto } from '@/api/mapConfig'

/** The map tile source, fetched once per session. */
export const useMapConfigStore = defineStore('mapConfig', () => {
  const config = ref<MapConfigDto | null>(null)
  let pending: Promise<MapConfigDto> | null = null

  async function ensureLoaded(): Promise<MapConfigDto> {
    if (config.value) return config.value
    pending ??= getMapConfig().finally(() => (pending = null))
    config.value = await pending
    return config.value
  }

  return { config, ensureLoaded }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useMapConfigStore, import.meta.hot))
