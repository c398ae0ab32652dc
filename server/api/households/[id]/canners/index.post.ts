import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { CannerSchema, withGaugeStatus } from '~~/utils/schemas/catalogue'

export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const body = await validBody(event, CannerSchema)
  const today = await cannerToday(db, id, body.lastGaugeTestAt)
  const canner = written(await db.insert(tables.canners).values({ ...body, householdId: id }).returning())
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'canner', summary: `Added the canner ${canner.name}` })
  setResponseStatus(event, 201)
  return withGaugeStatus(canner, today)
})
