import { dataKeys } from '~/utils/dataKeys'

/** Jar labels for the lots on the Shelf (all of them, or the lots named by id). */
export function useShelfLabels(lots: Ref<string | undefined>) {
  const { id, options } = useHouseholdRead(dataKeys.labels)
  return useFetch(() => `/api/households/${id.value}/shelf/labels` as const, { ...options, query: computed(() => ({ lots: lots.value })) })
}
