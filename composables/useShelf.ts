import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { z } from 'zod'
import type { ShelfCorrectionInput, TakeOffInput, TakeOffSchema } from '~/utils/schemas/shelf'

export type ShelfView = ApiAnswer<'/api/households/:id/shelf'>
export type ShelfImportAnswer = ApiAnswer<'/api/households/:id/shelf/import', 'post'>

/** The Shelf: lots on hand and in the refrigerator, taking jars off, undoing, correcting a lot, and CSV import. */
export function useShelf() {
  const { id, options } = useHouseholdRead(dataKeys.shelf)
  const shelf = useFetch(() => `/api/households/${id.value}/shelf` as const, options)
  const base = () => `/api/households/${id.value}/shelf` as const
  // Every write answers with the whole Shelf; the board and jar stock change with it. The answer
  // is typed by hand: matching these nested paths exhausts the route-type matcher.
  async function settle(path: string, body?: z.input<typeof TakeOffSchema> | ShelfCorrectionInput) {
    shelf.data.value = await $fetch<ShelfView>(`${base()}/${path}`, { method: 'POST', body })
    await refreshNuxtData([dataKeys.board(id.value), dataKeys.jarStock(id.value), dataKeys.labels(id.value)])
  }

  const takeOff = (items: TakeOffInput['items']) => settle('take-off', { items })
  const undo = () => settle('undo')
  const clearFridge = (itemId: string) => settle(`fridge/${itemId}/clear`)
  /** Put a lot's count right, or remove it (0 jars), with the reason; not use. */
  const correct = (lotId: string, body: ShelfCorrectionInput) => settle(`lots/${lotId}/correction`, body)
  async function importCsv(text: string): Promise<ShelfImportAnswer> {
    const answer = await $fetch<ShelfImportAnswer>(`${base()}/import`, { method: 'POST', body: text, headers: { 'content-type': 'text/csv' } })
    await refreshNuxtData([dataKeys.shelf(id.value), dataKeys.board(id.value), dataKeys.labels(id.value)])
    return answer
  }
  return { ...shelf, takeOff, undo, clearFridge, correct, importCsv }
}
