import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import type { ComparisonDto, ComparisonResultDto } from '@shared/types/comparison'
import * as api from '@/api/comparisons'
import { listFlights, type FlightListItemDto } from '@/api/flights'

/** The compare screen: which flights, which baseline, the computed result and the saved comparison. */
export const useCompareStore = defineStore('compare', () => {
  const candidates = ref<FlightListItemDto[]>([])
  const selectedIds = ref<number[]>([])
  const baselineId = ref<number | null>(null)
  const fadeMarginDb = ref(10)
  const result = ref<ComparisonResultDto | null>(null)
  const loading = ref(false)
  const savedId = ref<number | null>(null)
  const name = ref('')
  const conclusion = ref('')
  const saved = ref<ComparisonDto[]>([])

  const canCompare = computed(
    () => selectedIds.value.length >= 2 && selectedIds.value.length <= 6 && baselineId.value !== null &&
      selectedIds.value.includes(baselineId.value),
  )

  async function loadCandidates(): Promise<void> {
    const res = await listFlights({ sort: '-flownOn', pageSize: 100 })
    candidates.value = res.items.filter((f) => f.status === 'ready')
  }

  async function loadSaved(): Promise<void> {
    saved.value = (await api.listComparisons()).items
  }

  /** Sets the choice of flights; keeps the baseline when still chosen, else takes the first. */
  function choose(ids: number[]): void {
    selectedIds.value = ids.slice(0, 6)
    if (baselineId.value === null || !selectedIds.value.includes(baselineId.value)) {
      baselineId.value = selectedIds.value[0] ?? null
    }
  }

  async function compute(): Promise<void> {
    if (!canCompare.value) {
      result.value = null
      return
    }
    loading.value = true
    try {
      result.value = await api.previewComparison({
        flightIds: selectedIds.value,
        baselineId: baselineId.value!,
        fadeMarginDb: fadeMarginDb.value,
      })
    } finally {
      loading.value = false
    }
  }

  async function setBaseline(id: number): Promise<void> {
    baselineId.value = id
    await compute()
  }

  async function open(id: number): Promise<void> {
    loading.value = true
    try {
      const c = await api.getComparison(id)
      savedId.value = c.id
      name.value = c.name
      conclusion.value = c.conclusion
      selectedIds.value = c.flightIds
      baselineId.value = c.baselineId
      fadeMarginDb.value = c.fadeMarginDb
      result.value = c.result
    } finally {
      loading.value = false
    }
  }

  function startNew(ids: number[] = []): void {
    savedId.value = null
    name.value = ''
    conclusion.value = ''
    result.value = null
    baselineId.value = null
    choose(ids)
  }

  async function save(asNew = false): Promise<ComparisonDto> {
    const input = {
      name: name.value,
      conclusion: conclusion.value,
      flightIds: selectedIds.value,
      baselineId: baselineId.value!,
      fadeMarginDb: fadeMarginDb.value,
    }
    const c = savedId.value !== null && !asNew
      ? await api.updateComparison(savedId.value, input)
      : await api.createComparison(input)
    savedId.value = c.id
    return c
  }

  async function remove(id: number): Promise<void> {
    await api.deleteComparison(id)
    saved.value = saved.value.filter((c) => c.id !== id)
    if (savedId.value === id) savedId.value = null
  }

  return {
    candidates, selectedIds, baselineId, fadeMarginDb, result, loading, savedId, name, conclusion, saved,
    canCompare, loadCandidates, loadSaved, choose, compute, setBaseline, open, startNew, save, remove,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useCompareStore, import.meta.hot))
