import { HouseholdPlanParamsSchema } from '~~/utils/schemas/params'

/** The canning day as an iCalendar file: every step and each load's seal-check window (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id, planId }, db } = await requireHouseholdRole(event, HouseholdPlanParamsSchema, 'helper')
  const body = await planCalendar(db, id, planId, await householdTimeZone(db, id))
  setResponseHeaders(event, {
    'content-type': 'text/calendar; charset=utf-8',
    'content-disposition': `attachment; filename="canning-day-${planId.slice(0, 8)}.ics"`,
  })
  return body
})
