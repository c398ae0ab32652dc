import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { withGaugeStatus } from '~~/utils/schemas/catalogue'

/** The household's canners, each saying whether its dial gauge is due for an accuracy test. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const [today, canners] = await Promise.all([cannerToday(db, id), loadCanners(db, id)])
  return canners.map(row => withGaugeStatus(row, today))
})
