import { eq } from 'drizzle-orm'
import { HouseholdParamsSchema, HouseholdSettingsSchema } from '../../../../utils/schemas/household'

export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const body = await readValidatedBody(event, validateWith(HouseholdSettingsSchema))
  const { db } = await requireHouseholdRole(event, id, 'owner')
  const [household] = await db.update(tables.households)
    .set({ ...body, updatedAt: new Date() })
    .where(eq(tables.households.id, id))
    .returning()
  return household
})
