// Where to go back to after signing in: only a path on this site, never another origin.

const ORIGIN = 'http://veerline.invalid'

/**
 * `raw` when it is a same-site path (starts with one `/`, no scheme, no host, no backslash or control
 * character), else null. `//evil.example/` and `/\evil.example` are other hosts to a browser.
 */
export function safeReturnPath(raw: unknown): string | null {
  if (typeof raw !== 'string' || raw.length === 0 || raw.length > 2000) return null
  if (!raw.startsWith('/') || raw.startsWith('//')) return null
  // eslint-disable-next-line no-control-regex
  if (/[\\\u0000-\u001f\u007f]/.test(raw)) return null
  let url: URL
  try {
    url = new URL(raw, ORIGIN)
  }
  catch {
    return null
  }
  if (url.origin !== ORIGIN) return null
  // Going back to the sign-in page itself would only loop.
  if (url.pathname === '/sign-in') return null
  return url.pathname + url.search + url.hash
}

/** The sign-in address that brings the caller back to `fullPath` afterwards. */
export function signInPathFor(fullPath: string): { path: '/sign-in', query: Record<string, string> } {
  const next = safeReturnPath(fullPath)
  return { path: '/sign-in', query: next && next !== '/' ? { next } : {} }
}
