import { ShelfCorrectionSchema, ShelfLotParamsSchema } from '~~/utils/schemas/shelf'

/** Correct a lot's count or remove it, with the reason; not use (canner and up: it changes the books). */
export default defineEventHandler(async (event) => {
  const { params: { id, lotId }, db, user } = await requireHouseholdRole(event, ShelfLotParamsSchema, 'canner')
  const body = await validBody(event, ShelfCorrectionSchema)
  return correctLot(db, id, user.id, lotId, body)
})
