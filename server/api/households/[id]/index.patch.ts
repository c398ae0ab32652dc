import { eq } from 'drizzle-orm'
import { HouseholdParamsSchema, HouseholdSettingsSchema } from '~~/utils/schemas/household'

export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const body = await validBody(event, HouseholdSettingsSchema)
  const [household] = await db.update(tables.households)
    .set({ ...body, updatedAt: serverNow() })
    .where(eq(tables.households.id, id))
    .returning()
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'settings', summary: `Changed the household settings (${Object.keys(body).join(', ')})` })
  return household
})
