// Keeps the security rules nuxt-security resolved for this path (server/utils/security-rules.ts); they were worked
// out in its request hook, before any handler, and nothing of the response has changed them yet.
export default defineEventHandler((event) => {
  const security = event.context.security as { rules?: unknown } | undefined
  keepSecurityRules(event.path, security?.rules)
})
