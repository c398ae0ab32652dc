import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { JarStockInput } from '~/utils/schemas/catalogue'

export type JarStockView = ApiAnswer<'/api/households/:id/jar-stock'>[number]

/** Empty jars the household owns, by size, and setting the counts. */
export function useJarStock() {
  const { id, options } = useHouseholdRead(dataKeys.jarStock)
  const list = useFetch(() => `/api/households/${id.value}/jar-stock` as const, options)

  /** Sets each changed count in turn; the list is reread even when one of them is refused. */
  async function setCounts(changes: readonly JarStockInput[]) {
    try {
      for (const body of changes) await $fetch(`/api/households/${id.value}/jar-stock`, { method: 'PUT', body })
    }
    finally {
      await refreshNuxtData(dataKeys.jarStock(id.value))
    }
  }
  return { ...list, setCounts }
}
