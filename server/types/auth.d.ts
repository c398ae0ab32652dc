// Shape of the sealed session cookie (nuxt-auth-utils). The cookie only names a session; the
// server's record of it (the sessions table) decides whether it still counts.
declare module '#auth-utils' {
  interface User {
    id: string
    email: string
    name: string
    isAdmin: boolean
  }
  interface SecureSessionData {
    sessionId: string
  }
}
export {}
