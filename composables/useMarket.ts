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
  async function setChecked(itemKey: string, checked: boolean, state: MarketCheckState = 'bought') {
    const before = checks.data.value ?? []
    const others = before.filter(c => c.itemKey !== itemKey)
    const was = before.find(c => c.itemKey === itemKey)
    checks.data.value = checked ? [...others, { itemKey, state, checkedAt: now().toISOString(), checkedBy: auth.user.value?.name ?? null }] : others
    try {
      await $fetch(`${base()}/market`, { method: 'PUT', body: { itemKey, checked, state } })
    }
    catch (error) {
      checks.data.value = before
      throw error
    }
    const totalsChange = state === 'at-home' || was?.state === 'at-home'
    await refreshNuxtData([dataKeys.market(id.value, planId.value), ...(totalsChange ? [dataKeys.plan(id.value, planId.value)] : [])])
  }
  /** E-mails the list to one member; answers with the address it went to. */
  const send = (userId: string) => $fetch(`${base()}/send-market-list`, { method: 'POST', body: { userId } })
  return { ...checks, setChecked, send }
}
