import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import type { OutboxMessageDto } from '@shared/types/api'
import { listOutbox } from '@/api/outbox'

/** The dev mail sink's received messages; `available` is false when the sink is off or not for this user. */
export const useOutboxStore = defineStore('outbox', () => {
  const messages = ref<OutboxMessageDto[]>([])
  const available = ref(false)
  const loading = ref(false)

  async function fetchMessages(): Promise<void> {
    loading.value = true
    try {
      const result = await listOutbox()
      available.value = result !== null
      // newest first: the message just sent is the one people look for
      messages.value = (result?.items ?? [])
        .slice()
        .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt))
    } finally {
      loading.value = false
    }
  }

  function reset(): void {
    messages.value = []
    available.value = false
  }

  return { messages, available, loading, fetchMessages, reset }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useOutboxStore, import.meta.hot))
