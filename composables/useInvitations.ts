import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { InviteInput } from '~/utils/schemas/members'

export type InvitationView = ApiAnswer<'/api/households/:id/invitations'>[number]

/** Invitations of the active household still waiting, and sending, resending and withdrawing them (owners). */
export function useInvitations() {
  const auth = useAuth()
  const { id, options } = useHouseholdRead(dataKeys.invitations)
  const list = useFetch(() => `/api/households/${id.value}/invitations` as const, { ...options, immediate: options.immediate && auth.can('owner') })

  // Type arguments: Nitro's route matcher exceeds the type checker's depth on these paths.
  async function invite(body: InviteInput) {
    list.data.value = await $fetch<InvitationView[]>(`/api/households/${id.value}/invitations`, { method: 'POST', body })
  }
  async function resend(invitationId: string) {
    list.data.value = await $fetch<InvitationView[]>(`/api/households/${id.value}/invitations/${invitationId}/resend`, { method: 'POST' })
  }
  async function revoke(invitationId: string) {
    list.data.value = await $fetch<InvitationView[]>(`/api/households/${id.value}/invitations/${invitationId}`, { method: 'DELETE' })
  }
  return { ...list, invite, resend, revoke }
}
