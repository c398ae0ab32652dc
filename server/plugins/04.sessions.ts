import { sql } from 'drizzle-orm'

/**
 * The client asks nuxt-auth-utils' /api/_auth/session whether it is signed in: answer from the
 * server's session record, so a session ended elsewhere (sign out everywhere, a reset) reads as
 * signed out, and the person's name is current. Also makes the site admin named in
 * SHELFSTEAD_ADMIN_EMAIL at start.
 */
export default defineNitroPlugin(() => {
  sessionHooks.hook('fetch', async (session, event) => {
    const current = await currentSession(event)
    if (!current) {
      delete session.user
      delete session.secure
      return
    }
    session.user = current.user
  })

  const { adminEmail } = serverSettings()
  if (adminEmail) {
    useDB().then(async (db) => {
      const made = await db.update(tables.users).set({ isAdmin: true }).where(sql`lower(${tables.users.email}) = ${adminEmail}`).returning({ id: tables.users.id })
      if (made.length) console.info(`[shelfstead] ${adminEmail} is a site admin (SHELFSTEAD_ADMIN_EMAIL).`)
      else console.warn(`[shelfstead] SHELFSTEAD_ADMIN_EMAIL=${adminEmail} names no account yet: create the account, then restart.`)
    }).catch(error => console.error('[shelfstead] Could not make the site admin:', error))
  }
})
