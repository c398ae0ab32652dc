import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { PlanRequestBody } from '~/utils/schemas/plan'
import type { PlanStatus } from '~/utils/vocabulary'

export type SavedPlanView = ApiAnswer<'/api/households/:id/plans/:planId'>

/** One saved plan: reading it, renaming or changing it, copying and deleting it. */
export function usePlan(planId: Ref<string | null | undefined>) {
  const id = useAuth().activeId
  const key = computed(() => dataKeys.plan(id.value, planId.value))
  const plan = useFetch<SavedPlanView>(() => `/api/households/${id.value}/plans/${planId.value}`, {
    key,
    immediate: Boolean(id.value && planId.value),
    watch: [id],
  })
  const base = () => `/api/households/${id.value}/plans/${planId.value}` as const

  async function update(body: { name?: string, status?: PlanStatus, request?: PlanRequestBody }) {
    await $fetch(base(), { method: 'PATCH', body })
    await refreshNuxtData([key.value, dataKeys.plans(id.value), dataKeys.market(id.value, planId.value), dataKeys.board(id.value)])
  }
  async function copy() {
    const { plan: copied } = await $fetch(`${base()}/copy`, { method: 'POST' })
    await refreshNuxtData(dataKeys.plans(id.value))
    return copied
  }
  async function remove() {
    await $fetch(base(), { method: 'DELETE' })
    clearNuxtData(key.value)
    await refreshNuxtData(dataKeys.plans(id.value))
  }
  // `settled`: the first read's end, for a page that answers 404 when the record is not there.
  return { ...plan, settled: plan.then(() => undefined), update, copy, remove }
}
