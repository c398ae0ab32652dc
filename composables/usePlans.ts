import type { ApiAnswer } from '~/utils/api'
import { dataKeys } from '~/utils/dataKeys'
import type { PlanRequestBody } from '~/utils/schemas/plan'

export type PlanListItem = ApiAnswer<'/api/households/:id/plans'>[number]
export type PlanPreview = ApiAnswer<'/api/households/:id/plans/preview', 'post'>

/** The active household's saved plans, computing a preview, and saving a new plan. */
export function usePlans() {
  const { id, options } = useHouseholdRead(dataKeys.plans)
  const list = useFetch(() => `/api/households/${id.value}/plans` as const, options)

  /** Compute a plan; for a change to a saved plan, with that plan's progress. */
  const preview = (body: PlanRequestBody, planId?: string | null) =>
    $fetch(`/api/households/${id.value}/plans/preview`, { method: 'POST', body, query: planId ? { planId } : {} })

  async function create(name: string, request: PlanRequestBody) {
    const { plan } = await $fetch(`/api/households/${id.value}/plans`, { method: 'POST', body: { name, request } })
    await refreshNuxtData(dataKeys.plans(id.value))
    return plan
  }
  return { ...list, preview, create }
}
