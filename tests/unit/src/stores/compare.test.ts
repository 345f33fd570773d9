import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import type { ComparisonResultDto } from '@shared/types/comparison'
import { useCompareStore } from '@/stores/compare'
import * as api from '@/api/comparisons'

vi.mock('@/api/comparisons')
vi.mock('@/api/flights')

const result = (baselineId: number) => ({ baselineId, flightIds: [1, 2, 3], advantages: [], flights: [] }) as unknown as ComparisonResultDto

beforeEach(() => {
  vi.clearAllMocks()
  setActivePinia(createPinia())
  vi.mocked(api.previewComparison).mockImplementation(async (input) => result(input.baselineId))
})

describe('useCompareStore', () => {
  it('keeps the baseline while it stays chosen and falls back to the first flight otherwise', () => {
    const s = useCompareStore()
    s.choose([4, 5, 6])
    expect(s.baselineId).toBe(4)
    s.baselineId = 5
    s.choose([5, 6])
    expect(s.baselineId).toBe(5)
    s.choose([6, 7])
    expect(s.baselineId).toBe(6)
  })

  it('recomputes against a new baseline', async () => {
    const s = useCompareStore()
    s.choose([1, 2, 3])
    await s.setBaseline(2)
    expect(api.previewComparison).toHaveBeenLastCalledWith({ flightIds: [1, 2, 3], baselineId: 2, fadeMarginDb: 10 })
    expect(s.result!.baselineId).toBe(2)
  })

  it('does not ask the server with fewer than two flights', async () => {
    const s = useCompareStore()
    s.choose([1])
    await s.compute()
    expect(api.previewComparison).not.toHaveBeenCalled()
    expect(s.canCompare).toBe(false)
  })

  it('reopens a saved comparison with the same choices and saves changes to it', async () => {
    vi.mocked(api.getComparison).mockResolvedValue({
      id: 9, name: 'Power vs antenna', conclusion: 'c', flightIds: [1, 2, 3], baselineId: 1, fadeMarginDb: 12,
      createdBy: 1, createdByName: 'P', createdAt: '', updatedAt: '', result: result(1),
    })
    vi.mocked(api.updateComparison).mockImplementation(async (id, input) => ({ id, ...input, createdBy: 1, createdByName: 'P', createdAt: '', updatedAt: '' }))
    const s = useCompareStore()
    await s.open(9)
    expect([s.selectedIds, s.baselineId, s.fadeMarginDb, s.name]).toEqual([[1, 2, 3], 1, 12, 'Power vs antenna'])
    s.conclusion = 'new'
    await s.save()
    expect(api.updateComparison).toHaveBeenCalledWith(9, expect.objectContaining({ conclusion: 'new', baselineId: 1 }))
  })
})
