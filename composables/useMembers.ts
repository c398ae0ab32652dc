import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'

export type MemberView = ApiAnswer<'/api/households/:id/members'>[number]

/** The people in the active household, with their roles. */
export function useMembers() {
  const { id, options } = useHouseholdRead(dataKeys.members)
  return useFetch(() => `/api/households/${id.value}/members` as const, options)
}
