import { acceptHMRUpdate, defineStore } from 'pinia'
import { reactive, ref } from 'vue'
import type { CourseDto } from '@shared/types/course'
import type { LinkSetupDto } from '@shared/types/setup'
import * as flightsApi from '@/api/flights'
import type { FlightListItemDto, FlightListQuery } from '@/api/flights'
import { listCourses } from '@/api/courses'
import { listSetups } from '@/api/setups'

/** Sort keys the flights list offers (the server keeps the same whitelist). */
export const FLIGHT_SORT_KEYS = ['flownOn', 'name', 'createdAt', 'rowCount'] as const
export type FlightSortKey = (typeof FLIGHT_SORT_KEYS)[number]

/** The flights list: filters, sort and page live here and go to the server as they are. */
export const useFlightsStore = defineStore('flights', () => {
  const items = ref<FlightListItemDto[]>([])
  const total = ref(0)
  const loading = ref(false)
  const query = reactive<Required<Pick<FlightListQuery, 'page' | 'pageSize'>> & Omit<FlightListQuery, 'sort'> & { sort: FlightSortKey; order: 'asc' | 'desc' }>({
    q: '',
    courseId: undefined,
    setupId: undefined,
    from: undefined,
    to: undefined,
    sort: 'flownOn',
    order: 'desc',
    page: 1,
    pageSize: 20,
  })
  const courses = ref<CourseDto[]>([])
  const setups = ref<LinkSetupDto[]>([])
  let seq = 0

  async function fetchList(): Promise<void> {
    const mine = ++seq
    loading.value = true
    try {
      const { order, sort, ...rest } = query
      // the API takes one sort parameter: the key, with a leading '-' for descending
      const res = await flightsApi.listFlights({ ...rest, sort: `${order === 'desc' ? '-' : ''}${sort}` })
      if (mine !== seq) return
      items.value = res.items
      total.value = res.total
    } finally {
      if (mine === seq) loading.value = false
    }
  }

  /** Course and setup choices for the filters and the new-flight form. */
  async function fetchChoices(): Promise<void> {
    const [c, s] = await Promise.all([
      listCourses({ sort: 'name', order: 'asc', limit: 200 }),
      listSetups({ sort: 'name', order: 'asc', limit: 200 }),
    ])
    courses.value = c.items
    setups.value = s.items
  }

  /** Changes filters and goes back to the first page. */
  function setFilters(patch: Partial<Omit<FlightListQuery, 'sort'>>): void {
    Object.assign(query, patch, { page: 1 })
  }

  function setSort(sort: FlightSortKey, order: 'asc' | 'desc'): void {
    Object.assign(query, { sort, order, page: 1 })
  }

  async function remove(id: number): Promise<void> {
    await flightsApi.deleteFlight(id)
    await fetchList()
  }

  return { items, total, loading, query, courses, setups, fetchList, fetchChoices, setFilters, setSort, remove }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useFlightsStore, import.meta.hot))
