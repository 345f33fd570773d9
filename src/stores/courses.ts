import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import type { CourseDto } from '@shared/types/course'
import type { CourseInput, CourseListQuery } from '@shared/schemas/course'
import type { UploadProgress } from '@/api/client'
import * as coursesApi from '@/api/courses'

export const useCoursesStore = defineStore('courses', () => {
  const items = ref<CourseDto[]>([])
  const total = ref(0)
  const loading = ref(false)
  const current = ref<CourseDto | null>(null)

  async function fetchList(q: Partial<CourseListQuery>): Promise<void> {
    loading.value = true
    try {
      const res = await coursesApi.listCourses(q)
      items.value = res.items
      total.value = res.total
    } finally {
      loading.value = false
    }
  }

  async function fetchOne(id: number): Promise<CourseDto> {
    current.value = await coursesApi.getCourse(id)
    return current.value
  }

  async function save(id: number | null, input: CourseInput): Promise<CourseDto> {
    current.value = id === null ? await coursesApi.createCourse(input) : await coursesApi.updateCourse(id, input)
    return current.value
  }

  async function remove(id: number): Promise<void> {
    await coursesApi.deleteCourse(id)
    items.value = items.value.filter((c) => c.id !== id)
    total.value = Math.max(0, total.value - 1)
    if (current.value?.id === id) current.value = null
  }

  async function uploadTerrain(id: number, file: File, onProgress?: UploadProgress): Promise<CourseDto> {
    current.value = await coursesApi.uploadTerrain(id, file, onProgress)
    return current.value
  }

  async function removeTerrain(id: number): Promise<CourseDto> {
    current.value = await coursesApi.deleteTerrain(id)
    return current.value
  }

  return { items, total, loading, current, fetchList, fetchOne, save, remove, uploadTerrain, removeTerrain }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useCoursesStore, import.meta.hot))
