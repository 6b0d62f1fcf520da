// Signed-out visitors go to sign-in (with the way back); a page that needs a capability says so in
// definePageMeta({ can: '…' }), and a role without it goes to its own home page (shared/utils/capabilities.ts).
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  if (to.meta.public) return
  if (!loggedIn.value || !user.value) return navigateTo(signInPathFor(to.fullPath))
  if (to.meta.can && !can(user.value, to.meta.can)) return navigateTo(ROLE_HOME[user.value.role])
})
