import { ShelfLotParamsSchema } from '~~/utils/schemas/shelf'

/** One lot, as its jar label's QR code opens it (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id, lotId }, db } = await requireHouseholdRole(event, ShelfLotParamsSchema, 'helper')
  return shelfLot(db, id, lotId)
})
