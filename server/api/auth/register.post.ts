import { sql } from 'drizzle-orm'
import { RegisterSchema } from '~~/utils/schemas/auth'

/** Create an account and its household; the new user is the household's owner and is signed in. */
export default defineEventHandler(async (event) => {
  const body = await validBody(event, RegisterSchema)
  const db = await useDB()
  const [existing] = await db.select({ id: tables.users.id }).from(tables.users)
    .where(sql`lower(${tables.users.email}) = ${body.email}`)
  if (existing) {
    conflict('An account with that e-mail already exists. Sign in instead.')
  }
  const passwordHash = await hashPassword(body.password)
  const user = await db.transaction(async (tx) => {
    // The unique index on lower(email) settles two sign-ups racing for one address.
    const [created] = await tx.insert(tables.users)
      .values({ email: body.email, name: body.name, passwordHash })
      .returning()
    const [household] = await tx.insert(tables.households).values({ name: body.householdName, timeZone: body.timeZone ?? 'UTC' }).returning()
    await tx.insert(tables.memberships).values({ userId: created!.id, householdId: household!.id, role: 'owner' })
    return created!
  }).catch((error: unknown) => {
    const code = (error as { code?: string, cause?: { code?: string } }).code ?? (error as { cause?: { code?: string } }).cause?.code
    if (code === '23505') conflict('An account with that e-mail already exists. Sign in instead.')
    throw error
  })
  await setUserSession(event, { user: { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin } })
  setResponseStatus(event, 201)
  return { user: publicUser(user), households: await householdsOf(user.id) }
})
