import { dataKeys } from '~/utils/dataKeys'
import type { MarketCheckState } from '~/utils/vocabulary'

/** A saved plan's Market list check-offs, checking items off, and e-mailing the list. */
export function useMarket(planId: Ref<string | null | undefined>) {
  const id = useAuth().activeId
  const base = () => `/api/households/${id.value}/plans/${planId.value}` as const
  const checks = useFetch(() => `${base()}/market` as const, {
    key: computed(() => dataKeys.market(id.value, planId.value)),
    immediate: Boolean(id.value && planId.value),
  })

  const auth = useAuth()
  const { now } = useClock()
  /**
   * Shows the check at once (a helper in the shop ticks fast), then rereads who checked what.
   * 'at-home' marks an item the household already has: it leaves the shopping total, so the
   * saved plan is reread too.
   */
  let inFlight = 0
  let totalsChanged = false
  async function setChecked(itemKey: string, checked: boolean, state: MarketCheckState = 'bought') {
    const before = checks.data.value ?? []
    const others = before.filter(c => c.itemKey !== itemKey)
    const was = before.find(c => c.itemKey === itemKey)
    checks.data.value = checked ? [...others, { itemKey, state, checkedAt: now().toISOString(), checkedBy: auth.user.value?.name ?? null }] : others
    totalsChanged ||= state === 'at-home' || was?.state === 'at-home'
    inFlight++
    try {
      await $fetch(`${base()}/market`, { method: 'PUT', body: { itemKey, checked, state } })
    }
    catch (error) {
      checks.data.value = (checks.data.value ?? []).filter(c => c.itemKey !== itemKey).concat(before.filter(c => c.itemKey === itemKey))
      throw error
    }
    finally {
      inFlight--
    }
    // Reread once the last of several quick ticks is in, so an earlier answer never unticks a later box.
    if (inFlight > 0) return
    const keys = [dataKeys.market(id.value, planId.value), ...(totalsChanged ? [dataKeys.plan(id.value, planId.value)] : [])]
    totalsChanged = false
    await refreshNuxtData(keys)
  }
  /** E-mails the list to one member; answers with the address it went to. */
  const send = (userId: string) => $fetch(`${base()}/send-market-list`, { method: 'POST', body: { userId } })
  return { ...checks, setChecked, send }
}
