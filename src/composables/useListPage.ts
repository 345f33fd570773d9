import { onMounted, reactive } from 'vue'
import { ElMessage } from 'element-plus'
import { ApiError } from '@/api/client'

/** One page request of a searchable, sortable list. */
export interface ListPageParams<K extends string> {
  q?: string
  sort: K
  order: 'asc' | 'desc'
  limit: number
  offset: number
}

/** The search, sort and page the list view shows. */
export interface ListPageQuery<K extends string> {
  q: string
  sort: K
  order: 'asc' | 'desc'
  page: number
}

/** What ElTable's `sort-change` event gives. */
export interface TableSortChange {
  prop: string | null
  order: 'ascending' | 'descending' | null
}

const SEARCH_DEBOUNCE_MS = 250

/**
 * A list page over a store's `fetchList`: search box (debounced, back to page 1), column sort
 * and pagination; loads on mount and shows an API failure as a toast.
 */
export function useListPage<K extends string>(
  fetchList: (params: ListPageParams<K>) => Promise<void>,
  defaultSort: K,
  pageSize = 20,
) {
  const q = reactive({ q: '', sort: defaultSort, order: 'desc', page: 1 }) as ListPageQuery<K>

  async function load(): Promise<void> {
    try {
      await fetchList({ q: q.q || undefined, sort: q.sort, order: q.order, limit: pageSize, offset: (q.page - 1) * pageSize })
    } catch (e) {
      if (!(e instanceof ApiError)) throw e
      ElMessage.error(e.message)
    }
  }
  onMounted(load)

  let timer: ReturnType<typeof setTimeout> | undefined
  function onSearch(): void {
    clearTimeout(timer)
    timer = setTimeout(() => {
      q.page = 1
      void load()
    }, SEARCH_DEBOUNCE_MS)
  }
  function onSort({ prop, order }: TableSortChange): void {
    q.sort = (prop as K | null) ?? defaultSort
    q.order = order === 'ascending' ? 'asc' : 'desc'
    void load()
  }

  return { q, pageSize, load, onSearch, onSort }
}
