// nuxt-security works out the rules of a request from its path on every request: it clones the options of every
// route pattern, builds a router from them, matches the path and merges what matched, and builds another router for
// the name of the route (together about a tenth of the CPU of a kept briefing or list answer). Both depend on the
// path alone (the options are fixed once the server has started), so they are kept per path the first time. Each
// later request gets a copy of its own of the rules object and of its headers: the one change nuxt-security makes
// to them while answering (a page's CSP with its nonce, plugins/50-updateCsp) replaces `headers.contentSecurityPolicy`
// on that copy, never on the kept one. Bounded, oldest path out first.
type Rules = Record<string, unknown> & { headers?: unknown }
const KEPT_MAX = 1000
const byPath = new Map<string, { rules: Rules, route: string | undefined }>()

const pathOf = (url: string) => url.split('?')[0] ?? url

/** What is kept for this request's path: a copy of the rules, and the route's name; undefined when none is kept. */
export function keptSecurityRules(url: string): { rules: Rules, route: string | undefined } | undefined {
  const kept = byPath.get(pathOf(url))
  if (!kept) return undefined
  const { headers } = kept.rules
  const rules = { ...kept.rules, ...(headers && typeof headers === 'object' ? { headers: { ...headers } } : {}) }
  return { rules, route: kept.route }
}

/** Keeps the rules nuxt-security resolved for this path (before anything of the response changed them). */
export function keepSecurityRules(url: string, rules: unknown) {
  const path = pathOf(url)
  if (!rules || typeof rules !== 'object' || byPath.has(path)) return
  byPath.set(path, { rules: structuredClone(rules) as Rules, route: undefined })
  while (byPath.size > KEPT_MAX) byPath.delete(byPath.keys().next().value as string)
}

/** Keeps the route name nuxt-security resolved for this path (a string it never changes; known once answered). */
export function keepSecurityRoute(url: string, route: unknown) {
  const kept = byPath.get(pathOf(url))
  if (kept && kept.route === undefined && typeof route === 'string' && route) kept.route = route
}
