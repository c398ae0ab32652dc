import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { PriceItemInput } from '~/utils/schemas/catalogue'

export type PriceItemView = ApiAnswer<'/api/households/:id/prices'>[number]

/** The active household's price list: reading, adding or changing an item, removing one. */
export function usePrices() {
  const { id, options } = useHouseholdRead(dataKeys.prices)
  const list = useFetch(() => `/api/households/${id.value}/prices` as const, options)
  const refresh = () => refreshNuxtData(dataKeys.prices(id.value))

  async function save(body: PriceItemInput, priceId?: string) {
    if (priceId) await $fetch(`/api/households/${id.value}/prices/${priceId}`, { method: 'PATCH', body })
    else await $fetch(`/api/households/${id.value}/prices`, { method: 'POST', body })
    await refresh()
  }
  async function remove(priceId: string) {
    await $fetch(`/api/households/${id.value}/prices/${priceId}`, { method: 'DELETE' })
    await refresh()
  }
  return { ...list, save, remove }
}
