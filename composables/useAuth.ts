import type { LoginInput, RegisterInput } from '~/utils/schemas/auth'
import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { HouseholdRole } from '~/utils/schemas/household'
import { roleRank } from '~/utils/schemas/household'

export type MeResponse = ApiAnswer<'/api/auth/me'>

/**
 * The signed-in person, their households and the one this session works in (kept by the server
 * per session, so every route acts on it). `can('canner')` mirrors the server's role check so
 * pages hide what the server would refuse anyway.
 */
export function useAuth() {
  const session = useUserSession()
  const requestFetch = useRequestFetch()
  const { data: me, refresh } = useAsyncData<MeResponse | null>(
    dataKeys.me,
    // A type argument: with this many routes Nitro's route matcher exceeds the type checker's depth.
    () => (session.loggedIn.value ? requestFetch<MeResponse>('/api/auth/me') : Promise.resolve(null)),
    { watch: [session.loggedIn] },
  )

  const households = computed(() => me.value?.households ?? [])
  const active = computed(() => households.value.find(h => h.id === me.value?.activeHouseholdId) ?? null)
  const can = (minRole: HouseholdRole) => (active.value ? roleRank[active.value.role] >= roleRank[minRole] : false)

  /** After an answer that carries the session (sign-in, sign-up, an accepted invitation, a reset). */
  async function signedIn() {
    await session.fetch()
    await refresh()
  }

  /**
   * Open the app at `path` with the new session: a fresh load, so no screen starts from state
   * read before the person (or their household) changed. A client-side navigation here raced the
   * refetch of `me` and now and then left the Pantry board waiting for a household id.
   */
  function enter(path: string) {
    reloadNuxtApp({ path, persistState: false, force: true })
  }

  async function signIn(values: LoginInput) {
    await $fetch('/api/auth/login', { method: 'POST', body: values })
    await signedIn()
  }

  async function register(values: RegisterInput) {
    await $fetch('/api/auth/register', { method: 'POST', body: values })
    await signedIn()
  }

  /** Work in another of the person's households: every screen reloads its data. */
  async function select(householdId: string) {
    if (householdId === me.value?.activeHouseholdId) return
    me.value = await $fetch<MeResponse>('/api/auth/household', { method: 'POST', body: { householdId } })
    await refreshNuxtData()
  }

  /** What the service worker and the Canning day kept for offline use: never left for the next person. */
  async function forgetOnThisDevice() {
    if (!import.meta.client) return
    if ('caches' in window) await Promise.all(['shelfstead-api', 'shelfstead-pages'].map(name => caches.delete(name)))
    for (const key of Object.keys(localStorage)) if (key.startsWith('shelfstead-day-queue:')) localStorage.removeItem(key)
  }

  async function signedOut(stay = false) {
    await forgetOnThisDevice()
    await session.clear()
    me.value = null
    clearNuxtData()
    if (!stay) await navigateTo('/login')
  }

  /** Sign out; `stay` keeps the page (an invitation for another address, opened while signed in). */
  async function logout(options: { stay?: boolean } = {}) {
    await $fetch('/api/auth/logout', { method: 'POST' })
    await signedOut(options.stay)
  }

  async function logoutEverywhere() {
    await $fetch('/api/auth/logout-everywhere', { method: 'POST' })
    await signedOut()
  }

  return {
    loggedIn: session.loggedIn,
    user: computed(() => me.value?.user ?? null),
    households,
    active,
    activeId: computed(() => active.value?.id ?? null),
    select,
    can,
    signIn,
    signedIn,
    enter,
    register,
    refresh,
    logout,
    logoutEverywhere,
  }
}
