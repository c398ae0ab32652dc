import { defineStore } from 'pinia'

/**
 * The household the person is working in. Only the id is kept (in a cookie, so the server
 * render picks the same one); the household list itself comes from /api/auth/me.
 */
export const useHouseholdStore = defineStore('household', () => {
  const activeId = useCookie<string | null>('shelfstead-household', {
    default: () => null,
    sameSite: 'lax',
    maxAge: 60 * 60 * 24 * 365,
  })
  function select(id: string) {
    activeId.value = id
  }
  return { activeId, select }
})
