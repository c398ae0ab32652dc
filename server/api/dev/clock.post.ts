import { z } from '~~/utils/schemas/z'

const BodySchema = z.object({
  offsetMs: z.number({ invalid_type_error: 'Give the offset in whole milliseconds.' }).int().min(0, 'The clock only moves forward.').max(400 * 86_400_000),
})

/**
 * Move the server's clock forward (tests and `nuxt dev` only; a 404 unless SHELFSTEAD_TEST_CLOCK=1
 * or development), e.g. to see a seal check fall due the next day.
 */
export default defineEventHandler(async (event) => {
  if (!clockAdjustable()) notFound('Not found.')
  const body = await validBody(event, BodySchema)
  await setClockOffset(await useDB(), body.offsetMs)
  return { now: serverNow(), offsetMs: clockOffsetMs() }
})
