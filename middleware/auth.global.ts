const publicPages = new Set(['/login', '/register'])

/** Every screen but sign-in and create-account needs a session; the server checks roles itself. */
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn } = useUserSession()
  if (publicPages.has(to.path)) {
    if (loggedIn.value) return navigateTo('/')
    return
  }
  if (!loggedIn.value && to.path !== '/styleguide') {
    return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  }
})
