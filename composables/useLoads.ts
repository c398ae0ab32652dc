import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { LoadCreateInput, LoadListQuery } from '~/utils/schemas/logbook'
import type { UnsealedAction } from '~/utils/vocabulary'

export type LoadPage = ApiAnswer<'/api/households/:id/loads'>
export type LoadRow = LoadPage['rows'][number]
export type LoadDetail = ApiAnswer<'/api/households/:id/loads/:loadId'>

/** The keys whose answers change when a load is logged or its seal check recorded. */
export const afterLoadKeys = (householdId: string | null) =>
  [dataKeys.loads(householdId), dataKeys.board(householdId), dataKeys.shelf(householdId), dataKeys.jarStock(householdId), dataKeys.labels(householdId)]

/** The Logbook: one page of the active household's loads (filtered and sorted), and logging a load. */
export function useLoads(query: Ref<Partial<Record<keyof LoadListQuery, string | number | undefined>>>) {
  const { id, options } = useHouseholdRead(dataKeys.loads)
  const page = useFetch(() => `/api/households/${id.value}/loads` as const, { ...options, query })

  return { ...page, create: useLogLoad().create }
}

/** Logging a load, confirming one the Canning day logged, deciding an under-processed one; no list is fetched. */
export function useLogLoad() {
  const id = useAuth().activeId
  async function create(body: LoadCreateInput) {
    const load = await $fetch(`/api/households/${id.value}/loads`, { method: 'POST', body })
    await refreshNuxtData(afterLoadKeys(id.value))
    return load
  }
  /** The canner confirms a load the Canning day logged. */
  async function confirm(loadId: string) {
    // A bare string: the template type also matches loads/export.csv, which only answers GET.
    const url: string = `/api/households/${id.value}/loads/${loadId}`
    await $fetch(url, { method: 'PATCH', body: { confirmed: true } })
    await refreshNuxtData(afterLoadKeys(id.value))
  }
  /** An under-processed load's jars: refrigerate or reprocess, decided at once. */
  async function decide(loadId: string, action: UnsealedAction) {
    await $fetch(`/api/households/${id.value}/loads/${loadId}/decision`, { method: 'POST', body: { action } })
    await refreshNuxtData(afterLoadKeys(id.value))
  }
  return { create, confirm, decide }
}
