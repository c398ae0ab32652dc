import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { TakeOffSchema } from '~~/utils/schemas/shelf'

/** Take jars off the Shelf, one lot or many; the empty jars go back to jar stock (canner and up). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db, user } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const body = await validBody(event, TakeOffSchema)
  const shelf = await takeOff(db, id, user.id, body)
  const jars = body.items.reduce((sum, item) => sum + item.jars, 0)
  const products = [...new Set(body.items.map(item => shelf.lots.find(l => l.id === item.lotId)?.product).filter(Boolean))].join(', ')
  await recordActivity(db, { householdId: id, userId: user.id, kind: 'shelf', summary: `Took ${jars} jar${jars === 1 ? '' : 's'} off the Shelf${products ? ` (${products})` : ''}`, detail: { batchId: shelf.batchId } })
  return shelf
})
