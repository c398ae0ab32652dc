const publicPages = new Set(['/login', '/register', '/forgot'])
/** Open with or without a session: the link in an e-mail decides what they show. */
const linkPages = /^\/(invite|reset)\//

/** Every screen but sign-in, create-account, forgotten password and e-mailed links needs a session; the server checks roles itself. */
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn } = useUserSession()
  // An address that is no page answers 404 for everyone, signed in or not.
  if (to.matched.length === 0) return
  if (linkPages.test(to.path)) return
  if (publicPages.has(to.path)) {
    if (loggedIn.value) return navigateTo('/')
    return
  }
  if (!loggedIn.value && to.path !== '/styleguide') {
    return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  }
})
