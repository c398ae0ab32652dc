import type { LoginInput, RegisterInput } from '~/utils/schemas/auth'
import { dataKeys } from '~/utils/dataKeys'
import type { HouseholdRole } from '~/utils/schemas/household'
import { roleRank } from '~/utils/schemas/household'

export interface MeResponse {
  user: { id: string, email: string, name: string, isAdmin: boolean }
  households: Array<{ id: string, name: string, role: HouseholdRole }>
}

/**
 * The signed-in person, their households and the active one. `can('canner')` mirrors the
 * server's role check so pages hide what the server would refuse anyway.
 */
export function useAuth() {
  const session = useUserSession()
  const store = useHouseholdStore()
  const requestFetch = useRequestFetch()
  const { data: me, refresh } = useAsyncData<MeResponse | null>(
    dataKeys.me,
    () => (session.loggedIn.value ? requestFetch<MeResponse>('/api/auth/me') : Promise.resolve(null)),
    { watch: [session.loggedIn] },
  )

  const households = computed(() => me.value?.households ?? [])
  const active = computed(() =>
    households.value.find(h => h.id === store.activeId) ?? households.value[0] ?? null,
  )
  const can = (minRole: HouseholdRole) =>
    Boolean(me.value?.user.isAdmin) || (active.value ? roleRank[active.value.role] >= roleRank[minRole] : false)

  async function signedIn() {
    await session.fetch()
    await refresh()
  }

  async function signIn(values: LoginInput) {
    await $fetch('/api/auth/login', { method: 'POST', body: values })
    await signedIn()
  }

  async function register(values: RegisterInput) {
    await $fetch('/api/auth/register', { method: 'POST', body: values })
    await signedIn()
  }

  async function logout() {
    await $fetch('/api/auth/logout', { method: 'POST' })
    await session.clear()
    me.value = null
    await navigateTo('/login')
  }

  return {
    loggedIn: session.loggedIn,
    user: computed(() => me.value?.user ?? null),
    households,
    active,
    activeId: computed(() => active.value?.id ?? null),
    select: store.select,
    can,
    signIn,
    register,
    refresh,
    logout,
  }
}
