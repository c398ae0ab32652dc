import type { LabelQuery } from '~/utils/schemas/shelf'
import { dataKeys } from '~/utils/dataKeys'

/** Jar labels: the whole Shelf, the lots named by id, or one load's lots; one per jar left or a chosen count. */
export function useShelfLabels(query: Ref<Partial<Record<keyof LabelQuery, string | number | undefined>>>) {
  const { id, options } = useHouseholdRead(dataKeys.labels)
  return useFetch(() => `/api/households/${id.value}/shelf/labels` as const, { ...options, query })
}
