import type { ShelfView } from '~/composables/useShelf'
import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'

export type ShelfLotView = ApiAnswer<'/api/households/:id/shelf/lots/:lotId'>

/** One lot, as its jar label opens it on a phone: take one jar off, and undo that. */
export function useShelfLot(lotId: Ref<string>) {
  const id = useAuth().activeId
  const key = computed(() => dataKeys.shelfLot(id.value, lotId.value))
  const lot = useFetch(() => `/api/households/${id.value}/shelf/lots/${lotId.value}` as const, { key, immediate: Boolean(id.value), watch: [id] })
  const others = () => [dataKeys.shelf(id.value), dataKeys.board(id.value), dataKeys.jarStock(id.value), dataKeys.labels(id.value)]

  // The take-off and undo routes answer with the whole Shelf (typed by hand, as in useShelf).
  async function takeOne() {
    await $fetch<ShelfView>(`/api/households/${id.value}/shelf/take-off`, { method: 'POST', body: { items: [{ lotId: lotId.value, jars: 1 }] } })
    await refreshNuxtData([key.value, ...others()])
  }
  async function undo(batchId: string) {
    await $fetch<ShelfView>(`/api/households/${id.value}/shelf/undo`, { method: 'POST', body: { batchId } })
    await refreshNuxtData([key.value, ...others()])
  }
  // `settled`: the first read's end, for a page that answers 404 when the record is not there.
  return { ...lot, settled: lot.then(() => undefined), takeOne, undo }
}
