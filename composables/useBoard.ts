import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'

export type BoardView = ApiAnswer<'/api/households/:id/board'>

/** The Pantry board: what needs doing, what to eat soon, and how the season is going. */
export function useBoard() {
  const { id, options } = useHouseholdRead(dataKeys.board)
  return useFetch(() => `/api/households/${id.value}/board` as const, options)
}
