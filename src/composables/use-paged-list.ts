import { ref, shallowRef, type Ref } from 'vue'
import { useMessage } from 'naive-ui'
import type { Page } from '@shared/schemas/paging'
import { ApiError } from '@/api/http'

export interface PagedListOptions {
  pageSize: number
  /** Shown when loading fails and the server gave no message. */
  failureMessage: string
  /** Wait after the last keystroke before searching, ms. */
  searchDelayMs?: number
  /** How a failure is shown: a message toast (default) or only the `error` ref, for an inline alert. */
  errors?: 'message' | 'inline'
}

/**
 * The state every table page shares: the current page of rows, the total, a search box with a
 * short debounce, a loading flag, and errors shown as messages. `fetchPage` gets the page number,
 * size and search text and returns one page.
 */
export function usePagedList<T>(
  fetchPage: (query: { page: number; pageSize: number; search: string }) => Promise<Page<T>>,
  options: PagedListOptions,
) {
  const message = useMessage()
  const rows = shallowRef<T[]>([]) as Ref<T[]>
  const total = ref(0)
  const page = ref(1)
  const search = ref('')
  const loading = ref(false)
  const error = ref<string | null>(null)

  async function fetchCurrent(quiet: boolean): Promise<void> {
    if (!quiet) loading.value = true
    try {
      const result = await fetchPage({ page: page.value, pageSize: options.pageSize, search: search.value })
      rows.value = result.items
      total.value = result.total
      error.value = null
    } catch (err) {
      error.value = err instanceof ApiError ? err.message : options.failureMessage
      if (!quiet && options.errors !== 'inline') message.error(error.value)
    } finally {
      loading.value = false
    }
  }

  /** Loads the current page (also the pager's update handler, which passes the page number). */
  const load = (): Promise<void> => fetchCurrent(false)
  /** Reloads the current page in the background: no loading flag, no message on failure. */
  const refresh = (): Promise<void> => fetchCurrent(true)

  /** Back to the first page and load again (after the filters changed). */
  function reload(): Promise<void> {
    page.value = 1
    return load()
  }

  let searchTimer: ReturnType<typeof setTimeout> | undefined
  /** Call on every keystroke in the search box. */
  function onSearch(): void {
    clearTimeout(searchTimer)
    searchTimer = setTimeout(() => void reload(), options.searchDelayMs ?? 250)
  }

  return { rows, total, page, pageSize: options.pageSize, search, loading, error, load, refresh, reload, onSearch }
}
