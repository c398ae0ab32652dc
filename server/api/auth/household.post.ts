import { eq } from 'drizzle-orm'
import { SwitchHouseholdSchema } from '~~/utils/schemas/auth'

/** Switch the household this session works in: one of the person's own, else 404. */
export default defineEventHandler(async (event) => {
  const current = await requireSession(event)
  const { householdId } = await validBody(event, SwitchHouseholdSchema)
  const households = await householdsOf(current.user.id)
  if (!households.some(h => h.id === householdId)) notFound('No such household.')
  const db = await useDB()
  await db.update(tables.sessions).set({ activeHouseholdId: householdId }).where(eq(tables.sessions.id, current.session.id))
  current.session.activeHouseholdId = householdId
  return sessionAnswer(current)
})
