import { sql } from 'drizzle-orm'
import { LoginSchema } from '~~/utils/schemas/auth'

/**
 * Sign in. One vague 401 for an unknown address or a wrong password, taking as long either way;
 * five wrong passwords for one address within a minute, or thirty attempts from one client,
 * answer 429 until the minute is up.
 */
export default defineEventHandler(async (event) => {
  const body = await validBody(event, LoginSchema)
  const client = clientAddress(event)
  await spend(event, 'signInPerClient', client, 'sign-in attempts from this device')
  await refuseIfSpent(event, 'wrongPasswordPerAddress', body.email, 'wrong passwords for this address')
  const db = await useDB()
  const [user] = await db.select().from(tables.users).where(sql`lower(${tables.users.email}) = ${body.email}`)
  if (!await passwordMatches(user?.passwordHash, body.password) || !user) {
    await spend(event, 'wrongPasswordPerAddress', body.email, 'wrong passwords for this address')
    unauthorized('That e-mail and password do not match an account.')
  }
  await forgive('wrongPasswordPerAddress', body.email)
  const households = await householdsOf(user.id)
  await startSession(event, user, households[0]?.id ?? null)
  return sessionAnswer(await requireSession(event))
})
