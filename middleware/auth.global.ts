import type { RoleName } from '#shared/utils/roles'

// Signed-out visitors go to sign-in; pages may list the roles they admit in definePageMeta({ roles }).
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  if (to.meta.public) return
  if (!loggedIn.value) {
    return navigateTo({ path: '/sign-in', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  }
  const roles = to.meta.roles as RoleName[] | undefined
  if (roles && user.value && !roles.includes(user.value.role)) {
    return navigateTo(ROLE_HOME[user.value.role])
  }
})
