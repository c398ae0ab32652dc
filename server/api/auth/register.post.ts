import { sql } from 'drizzle-orm'
import { RegisterSchema } from '~~/utils/schemas/auth'

/**
 * Create an account and its household; the new person is the household's owner and is signed in.
 * The address named by SHELFSTEAD_ADMIN_EMAIL becomes the site admin (the first admin of an install).
 */
export default defineEventHandler(async (event) => {
  const body = await validBody(event, RegisterSchema)
  refuseCommonPassword('password', body.password)
  const db = await useDB()
  const [existing] = await db.select({ id: tables.users.id }).from(tables.users)
    .where(sql`lower(${tables.users.email}) = ${body.email}`)
  if (existing) conflict('An account with that e-mail already exists. Sign in instead.', 'email')
  const passwordHash = await hashPassword(body.password)
  const { user, household } = await db.transaction(async (tx) => {
    // The unique index on lower(email) settles two sign-ups racing for one address.
    const [user] = await tx.insert(tables.users).values({ email: body.email, name: body.name, passwordHash, isAdmin: body.email === serverSettings().adminEmail }).returning()
    // No altitude yet: the planner asks for it before it gives any pressure.
    const [household] = await tx.insert(tables.households).values({ name: body.householdName, timeZone: body.timeZone ?? 'UTC' }).returning()
    await tx.insert(tables.memberships).values({ userId: user!.id, householdId: household!.id, role: 'owner' })
    await recordActivity(tx, { householdId: household!.id, userId: user!.id, kind: 'member', summary: 'Created the household' })
    return { user: user!, household: household! }
  }).catch((error: unknown) => {
    if (isUniqueViolation(error)) conflict('An account with that e-mail already exists. Sign in instead.', 'email')
    throw error
  })
  await startSession(event, user, household.id)
  setResponseStatus(event, 201)
  return sessionAnswer(await requireSession(event))
})
