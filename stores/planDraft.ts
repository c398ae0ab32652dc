import { defineStore } from 'pinia'
import type { PlanRequestBody } from '~/utils/schemas/plan'

/** The unsaved plan on the Batch planner, kept while the canner looks at other screens. */
export const usePlanDraftStore = defineStore('planDraft', () => {
  const request = ref<Partial<PlanRequestBody> | null>(null)
  function keep(draft: Partial<PlanRequestBody>) {
    request.value = JSON.parse(JSON.stringify(draft)) as Partial<PlanRequestBody>
  }
  function clear() {
    request.value = null
  }
  return { request, keep, clear }
})
