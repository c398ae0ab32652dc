import { HouseholdParamsSchema } from '../../../../../utils/schemas/household'
import { withGaugeStatus } from '../../../../../utils/schemas/catalogue'

/** The household's canners, each saying whether its dial gauge is due for an accuracy test. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, validateWith(HouseholdParamsSchema))
  const { db } = await requireHouseholdRole(event, id, 'helper')
  return (await loadCanners(db, id)).map(row => withGaugeStatus(row))
})
