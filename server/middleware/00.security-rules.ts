// Keeps the security rules nuxt-security resolved for this path (server/utils/security-rules.ts); they were worked
// out in its request hook, before any route, and nothing of the response has changed them yet.
export default defineEventHandler((event) => {
  keepSecurityRules(event.path, (event.context.security as { rules?: unknown } | undefined)?.rules)
})
