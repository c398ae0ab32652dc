import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { HouseholdRole } from '~/utils/schemas/household'

export type MemberView = ApiAnswer<'/api/households/:id/members'>[number]

/** The people in the active household with their roles; owners change roles and remove members, anyone may leave. */
export function useMembers() {
  const auth = useAuth()
  const { id, options } = useHouseholdRead(dataKeys.members)
  const list = useFetch(() => `/api/households/${id.value}/members` as const, options)

  async function setRole(userId: string, role: HouseholdRole) {
    // Type argument: Nitro's route matcher gives up on nested template paths.
    list.data.value = await $fetch<MemberView[]>(`/api/households/${id.value}/members/${userId}`, { method: 'PATCH', body: { role } })
    await auth.refresh()
  }

  async function remove(userId: string) {
    await $fetch(`/api/households/${id.value}/members/${userId}`, { method: 'DELETE' })
    if (userId === auth.user.value?.id) {
      // Left the household: the session moves to another one, or to none.
      await auth.refresh()
      await refreshNuxtData()
      await navigateTo('/')
      return
    }
    await refreshNuxtData(dataKeys.members(id.value))
  }
  return { ...list, setRole, remove }
}
