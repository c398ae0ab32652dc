import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { MeResponse } from '~/composables/useAuth'
import type { AcceptInvitationInput } from '~/utils/schemas/members'

export type InvitationLink = ApiAnswer<'/api/invitations/:token'>

/** The invitation behind a link (anyone holding it may read it) and accepting it. */
export function useInvitation(token: string) {
  const auth = useAuth()
  const read = useFetch(`/api/invitations/${token}` as const, { key: dataKeys.invitation(token) })

  async function accept(body: AcceptInvitationInput) {
    await $fetch<MeResponse>(`/api/invitations/${token}/accept`, { method: 'POST', body })
    await auth.signedIn()
    await refreshNuxtData()
  }
  return { ...read, accept }
}
