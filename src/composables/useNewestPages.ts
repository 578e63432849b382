import { computed, ref, shallowRef } from 'vue'
import { isApiError } from '@/api/client'

// A document list shown newest first, a page at a time (the server's `limit` and `beforeId`): the first page
// on `reload`, the next one appended on `more`. A page that came back full may have more behind it. A reload
// while a page is on its way wins: the older answer is dropped.
export const LIST_PAGE = 50

export function useNewestPages<T extends { id: number }>(load: (page: { limit: number; beforeId?: number }) => Promise<T[]>) {
  const rows = shallowRef<T[]>([])
  const loading = ref(false)
  const error = ref('')
  const full = ref(false)
  let latest = 0
  async function fetchPage(beforeId: number | undefined): Promise<void> {
    const mine = ++latest
    loading.value = true
    error.value = ''
    try {
      const page = await load({ limit: LIST_PAGE, beforeId })
      if (mine !== latest) return
      rows.value = beforeId === undefined ? page : [...rows.value, ...page]
      full.value = page.length === LIST_PAGE
    } catch (err) {
      if (mine === latest) error.value = isApiError(err) ? err.message : String(err)
    } finally {
      if (mine === latest) loading.value = false
    }
  }
  const reload = () => fetchPage(undefined)
  const more = () => fetchPage(rows.value.at(-1)?.id)
  return { rows, loading, error, reload, more, hasMore: computed(() => full.value && !loading.value) }
}
