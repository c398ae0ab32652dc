import { sql } from 'drizzle-orm'
import { LoginSchema } from '~~/utils/schemas/auth'

/** One vague 401 for an unknown e-mail or a wrong password, so sign-in reveals no accounts. */
export default defineEventHandler(async (event) => {
  const body = await validBody(event, LoginSchema)
  const db = await useDB()
  const [user] = await db.select().from(tables.users).where(sql`lower(${tables.users.email}) = ${body.email}`)
  if (!user || !(await verifyPassword(user.passwordHash, body.password))) {
    unauthorized('That e-mail and password do not match an account.')
  }
  await replaceUserSession(event, { user: { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin } })
  return { user: publicUser(user), households: await householdsOf(user.id) }
})
