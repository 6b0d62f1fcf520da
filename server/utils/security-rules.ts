// nuxt-security works out the rules of a request from its path on every request: it clones the options of every
// route pattern, builds a router from them, matches the path and merges what matched (about a tenth of the CPU of a
// cached briefing or list answer). The result depends on the path alone (the options are fixed once the server has
// started), so it is kept per path the first time and each later request of that path gets its own copy: a page's
// answer still changes its copy (the CSP nonce), never the kept one. Bounded, oldest path out first.
const KEPT_MAX = 1000
const byPath = new Map<string, unknown>()

const pathOf = (url: string) => url.split('?')[0] ?? url

/** A fresh copy of the rules kept for this request's path, or undefined when none is kept yet. */
export function keptSecurityRules(url: string): unknown {
  const kept = byPath.get(pathOf(url))
  return kept === undefined ? undefined : structuredClone(kept)
}

/** Keeps the rules nuxt-security resolved for this path (before anything of the response changed them). */
export function keepSecurityRules(url: string, rules: unknown) {
  const path = pathOf(url)
  if (rules === undefined || byPath.has(path)) return
  byPath.set(path, structuredClone(rules))
  while (byPath.size > KEPT_MAX) byPath.delete(byPath.keys().next().value as string)
}
