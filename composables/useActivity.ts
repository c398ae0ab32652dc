import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'

export type ActivityPage = ApiAnswer<'/api/households/:id/activity'>

/** The active household's activity record, one page at a time, newest first (owners). */
export function useActivity() {
  const auth = useAuth()
  const page = ref(1)
  const id = auth.activeId
  const read = useFetch(() => `/api/households/${id.value}/activity` as const, {
    key: computed(() => dataKeys.activity(id.value, page.value)),
    query: { page },
    immediate: Boolean(id.value) && auth.can('owner'),
    watch: [id, page],
  })
  return { ...read, page }
}
