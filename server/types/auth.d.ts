// Shape of the sealed session cookie (nuxt-auth-utils).
declare module '#auth-utils' {
  interface User {
    id: string
    email: string
    name: string
    isAdmin: boolean
  }
}
export {}
