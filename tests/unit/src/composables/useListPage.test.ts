// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import { flushPromises, mount } from '@vue/test-utils'
import { useListPage, type ListPageParams } from '@/composables/useListPage'
import { ApiError } from '@/api/client'

type Key = 'name' | 'updatedAt'

/** Mounts a bare component over useListPage; `calls` records every fetchList request. */
function mountList(fetchList: (p: ListPageParams<Key>) => Promise<void>) {
  let page!: ReturnType<typeof useListPage<Key>>
  const Host = defineComponent({
    setup() {
      page = useListPage<Key>(fetchList, 'updatedAt', 10)
      return () => h('div')
    },
  })
  const wrapper = mount(Host)
  return { wrapper, page }
}

afterEach(() => {
  vi.useRealTimers()
})

describe('useListPage', () => {
  it('loads the first page on mount, newest first', async () => {
    const calls: ListPageParams<Key>[] = []
    mountList(async (p) => void calls.push(p))
    await flushPromises()
    expect(calls).toEqual([{ q: undefined, sort: 'updatedAt', order: 'desc', limit: 10, offset: 0 }])
  })

  it('maps a table sort onto sort and order, and a cleared sort back to the default', async () => {
    const calls: ListPageParams<Key>[] = []
    const { page } = mountList(async (p) => void calls.push(p))
    page.onSort({ prop: 'name', order: 'ascending' })
    page.onSort({ prop: null, order: null })
    await flushPromises()
    expect(calls.slice(1).map((c) => [c.sort, c.order])).toEqual([
      ['name', 'asc'],
      ['updatedAt', 'desc'],
    ])
  })

  it('waits for typing to pause, then searches from page 1', async () => {
    vi.useFakeTimers()
    const calls: ListPageParams<Key>[] = []
    const { page } = mountList(async (p) => void calls.push(p))
    await flushPromises()
    page.q.page = 3
    page.q.q = 'ri'
    page.onSearch()
    page.q.q = 'ridge'
    page.onSearch()
    expect(calls).toHaveLength(1)
    vi.runAllTimers()
    await flushPromises()
    expect(calls).toHaveLength(2)
    expect(calls[1]).toMatchObject({ q: 'ridge', offset: 0 })
    expect(page.q.page).toBe(1)
  })

  it('asks for the page the pager shows', async () => {
    const calls: ListPageParams<Key>[] = []
    const { page } = mountList(async (p) => void calls.push(p))
    page.q.page = 4
    await page.load()
    expect(calls.at(-1)).toMatchObject({ limit: 10, offset: 30 })
  })

  it('keeps an API failure inside the page and lets any other error through', async () => {
    const { page } = mountList(async () => {
      throw new ApiError(500, 'INTERNAL', 'Internal error')
    })
    await expect(page.load()).resolves.toBeUndefined()
    let mounted = false
    const broken = mountList(async () => {
      if (mounted) throw new TypeError('bug')
    })
    await flushPromises()
    mounted = true
    await expect(broken.page.load()).rejects.toThrow('bug')
  })
})
