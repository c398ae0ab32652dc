import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { DryGoodsInput } from '~/utils/schemas/catalogue'

export type DryGoodsView = ApiAnswer<'/api/households/:id/dry-goods'>[number]

/** Dry goods in the household's pantry, by bean, and setting one (0 clears it). */
export function useDryGoods() {
  const { id, options } = useHouseholdRead(dataKeys.dryGoods)
  const list = useFetch(() => `/api/households/${id.value}/dry-goods` as const, options)
  async function set(body: DryGoodsInput) {
    try {
      await $fetch(`/api/households/${id.value}/dry-goods`, { method: 'PUT', body })
    }
    finally {
      await refreshNuxtData(dataKeys.dryGoods(id.value))
    }
  }
  return { ...list, set }
}
