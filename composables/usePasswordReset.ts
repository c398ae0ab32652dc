import { dataKeys } from '~/utils/dataKeys'
import type { MeResponse } from '~/composables/useAuth'

/** Asking for a reset link, whether a link still works, and choosing the new password with it. */
export function usePasswordReset() {
  const auth = useAuth()

  async function request(email: string) {
    return $fetch('/api/auth/reset-request', { method: 'POST', body: { email } })
  }

  function linkStatus(token: string) {
    return useFetch(`/api/auth/reset/${token}` as const, { key: dataKeys.resetLink(token) })
  }

  async function reset(token: string, password: string) {
    // Type argument: Nitro's route matcher exceeds the type checker's depth here.
    await $fetch<MeResponse>('/api/auth/reset', { method: 'POST', body: { token, password } })
    await auth.signedIn()
  }
  return { request, linkStatus, reset }
}
