import { z } from './z'

export const HouseholdPlanParamsSchema = z.object({
  id: z.string().uuid('That household id is not valid.'),
  planId: z.string().uuid('That plan id is not valid.'),
})
