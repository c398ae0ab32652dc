import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { CannerInput } from '~/utils/schemas/catalogue'

/** A canner as the planner sees it, plus whether its dial gauge is due for its yearly test. */
export type CannerView = ApiAnswer<'/api/households/:id/canners'>[number]

/** The active household's canners: the list, adding or changing one, removing one. */
export function useCanners() {
  const { id, options } = useHouseholdRead(dataKeys.canners)
  const list = useFetch(() => `/api/households/${id.value}/canners` as const, options)
  const refresh = () => refreshNuxtData(dataKeys.canners(id.value))

  async function save(body: CannerInput, cannerId?: string) {
    if (cannerId) await $fetch(`/api/households/${id.value}/canners/${cannerId}`, { method: 'PATCH', body })
    else await $fetch(`/api/households/${id.value}/canners`, { method: 'POST', body })
    await refresh()
  }
  async function remove(cannerId: string) {
    await $fetch(`/api/households/${id.value}/canners/${cannerId}`, { method: 'DELETE' })
    await refresh()
  }
  return { ...list, save, remove }
}
