import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import type { LinkSetupDto } from '@shared/types/setup'
import type { SetupInput, SetupListQuery } from '@shared/schemas/setup'
import * as setupsApi from '@/api/setups'

export const useSetupsStore = defineStore('setups', () => {
  const items = ref<LinkSetupDto[]>([])
  const total = ref(0)
  const loading = ref(false)
  const current = ref<LinkSetupDto | null>(null)
  const versions = ref<LinkSetupDto[]>([])

  async function fetchList(q: Partial<SetupListQuery>): Promise<void> {
    loading.value = true
    try {
      const res = await setupsApi.listSetups(q)
      items.value = res.items
      total.value = res.total
    } finally {
      loading.value = false
    }
  }

  /** Loads one version and the history of its setup. */
  async function fetchOne(id: number): Promise<LinkSetupDto> {
    const [one, hist] = await Promise.all([setupsApi.getSetup(id), setupsApi.listSetupVersions(id)])
    current.value = one
    versions.value = hist.items
    return one
  }

  /** Creates, or edits the current version; the answer may be a new version when flights use the old one. */
  async function save(id: number | null, input: SetupInput): Promise<LinkSetupDto> {
    const saved = id === null ? await setupsApi.createSetup(input) : await setupsApi.updateSetup(id, input)
    current.value = saved
    versions.value = (await setupsApi.listSetupVersions(saved.id)).items
    return saved
  }

  async function remove(id: number): Promise<void> {
    await setupsApi.deleteSetup(id)
    items.value = items.value.filter((s) => s.id !== id)
    total.value = Math.max(0, total.value - 1)
  }

  return { items, total, loading, current, versions, fetchList, fetchOne, save, remove }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useSetupsStore, import.meta.hot))
