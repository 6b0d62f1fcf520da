// Wires the server-side sessions and the HTTPS-only headers into the modules that own the cookie and the headers.
import { dummyPasswordHash } from '../domain/accounts/credentials'
import { endSession, sessionUserOrEnd, type SessionData } from '../domain/accounts/session-store'
import { isHttpsDeployment } from '../utils/request-guard'

export default defineNitroPlugin((nitroApp) => {
  // nuxt-auth-utils' own GET /api/_auth/session (what useUserSession() reads) checks the stored session too, so a
  // page never shows someone as signed in whose session has ended; any cleared cookie ends its stored row.
  sessionHooks.hook('fetch', async (_session, event) => {
    await sessionUserOrEnd(event)
  })
  sessionHooks.hook('clear', async (session) => {
    await endSession((session as SessionData).sid)
  })

  // Made now, so the first sign-in with an unknown e-mail costs what every other one does.
  dummyPasswordHash({ hash: hashPassword, verify: verifyPassword }).catch(err => console.error('[veerline] dummy hash:', err?.message))

  // The security rules of a path already worked out are handed to nuxt-security (its request hook reads them from
  // the request's context; this plugin's hooks run before its own): server/utils/security-rules.ts.
  nitroApp.hooks.hook('request', (event) => {
    const kept = keptSecurityRules(event.path)
    if (!kept) return
    type Context = NonNullable<typeof event.context.security>
    event.context.security = { ...event.context.security, rules: kept.rules as Context['rules'], ...(kept.route === undefined ? {} : { route: kept.route }) }
  })
  nitroApp.hooks.hook('beforeResponse', (event) => {
    keepSecurityRoute(event.path, (event.context.security as { route?: unknown } | undefined)?.route)
  })

  // HSTS and upgrade-insecure-requests only where Veerline is served over HTTPS (wrong on the plain-HTTP loopback).
  if (isHttpsDeployment()) {
    nitroApp.hooks.hook('nuxt-security:routeRules', (rules) => {
      const csp = rules['/**']?.headers && typeof rules['/**'].headers === 'object' ? rules['/**'].headers.contentSecurityPolicy : undefined
      if (csp && typeof csp === 'object') (csp as Record<string, unknown>)['upgrade-insecure-requests'] = true
    })
  }
})
