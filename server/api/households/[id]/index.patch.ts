import { eq } from 'drizzle-orm'
import { HouseholdParamsSchema, HouseholdSettingsSchema } from '~~/utils/schemas/household'

export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const body = await validBody(event, HouseholdSettingsSchema)
  const [household] = await db.update(tables.households)
    .set({ ...body, updatedAt: serverNow() })
    .where(eq(tables.households.id, id))
    .returning()
  return household
})
