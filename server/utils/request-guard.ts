// The checks every write to /api/ passes before any route sees it (server/middleware/01.request-guard.ts):
// cross-site writes, declared body types, body size (refused before the body is read in full), a byte order mark
// and JSON nesting. Pure functions here; the middleware wires them to h3.

export const JSON_MAX_DEPTH = 64
/** Bodies of the profile routes (filing, import, preview, coded reports) may be as large as a profile file. */
export const PROFILE_BODY_MAX_BYTES = 2 * 1024 * 1024
export const DEFAULT_BODY_MAX_BYTES = 128 * 1024

const PROFILE_BODY_PATHS = [
  /^\/api\/airfields\/[^/]+\/profiles(\/import)?$/,
  /^\/api\/wind\/(preview|coded)$/,
]
const IMPORT_PATH = /^\/api\/airfields\/[^/]+\/profiles\/import$/

export function bodyLimitFor(pathname: string): number {
  return PROFILE_BODY_PATHS.some(p => p.test(pathname)) ? PROFILE_BODY_MAX_BYTES : DEFAULT_BODY_MAX_BYTES
}

/** The media types a route takes a body in: JSON everywhere; the import route also its file types. */
export function acceptedBodyTypes(pathname: string): string[] {
  return IMPORT_PATH.test(pathname) ? ['application/json', 'text/csv'] : ['application/json']
}

/** The bare media type of a Content-Type header: `application/json; charset=utf-8` gives `application/json`. */
export function mediaType(contentType: string | undefined): string {
  return (contentType ?? '').split(';')[0]!.trim().toLowerCase()
}

export function isJsonType(type: string): boolean {
  return type === 'application/json' || /^application\/[a-z0-9.+-]+\+json$/.test(type)
}

export type OriginVerdict = { ok: true } | { ok: false, message: string }

/**
 * A cookie-carrying write must come from one of our own pages: Sec-Fetch-Site same-origin (sent by current
 * browsers), or else an Origin header equal to one of our origins. A request with neither is refused too: every
 * browser sends Origin on a cross-origin write, and our own pages send both.
 */
export function originVerdict(headers: { origin?: string, secFetchSite?: string }, ownOrigins: string[]): OriginVerdict {
  const refused = 'This request came from another site and was refused; use Veerline\'s own pages (or an API token for feeds)'
  const site = headers.secFetchSite?.trim().toLowerCase()
  if (site && site !== 'same-origin') return { ok: false, message: refused }
  const origin = headers.origin?.trim()
  if (origin) {
    if (origin === 'null' || !ownOrigins.includes(origin.toLowerCase())) return { ok: false, message: refused }
    return { ok: true }
  }
  if (site === 'same-origin') return { ok: true }
  return { ok: false, message: 'This request had no Origin header; a signed-in write must come from Veerline\'s own pages (or use an API token)' }
}

/** The origin (scheme://host[:port], lower case) of a URL, or null when it is not one. */
export function originOf(url: string | undefined): string | null {
  if (!url) return null
  try {
    const u = new URL(url)
    return u.protocol === 'http:' || u.protocol === 'https:' ? u.origin.toLowerCase() : null
  }
  catch {
    return null
  }
}

/** Removes a leading UTF-8 byte order mark, so every body is read the same whichever editor saved it. */
export function stripBom(body: Buffer): Buffer {
  return body.length >= 3 && body[0] === 0xEF && body[1] === 0xBB && body[2] === 0xBF ? body.subarray(3) : body
}

/**
 * How deep the arrays and objects of a JSON text nest (0 for a bare value), counted without parsing, so a
 * hostile document cannot exhaust the stack of whatever parses it next. Brackets inside strings do not count.
 * Stops counting once past `stopAt`.
 */
export function jsonDepth(text: string, stopAt = Number.POSITIVE_INFINITY): number {
  let depth = 0
  let max = 0
  let inString = false
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i)
    if (inString) {
      if (c === 0x5C) i++ // backslash: skip the escaped character
      else if (c === 0x22) inString = false
      continue
    }
    if (c === 0x22) inString = true
    else if (c === 0x5B || c === 0x7B) {
      depth++
      if (depth > max) {
        max = depth
        if (max > stopAt) return max
      }
    }
    else if (c === 0x5D || c === 0x7D) depth--
  }
  return max
}

/** Whether the public address (NUXT_PUBLIC_APP_URL) is https: only then are HSTS and upgrade-insecure-requests sent. */
export function isHttpsDeployment(appUrl = process.env.NUXT_PUBLIC_APP_URL): boolean {
  if (appUrl === lastAppUrl) return lastHttps
  lastAppUrl = appUrl
  lastHttps = originOf(appUrl)?.startsWith('https:') ?? false
  return lastHttps
}
// The last answer, for the address it was for (asked on every response; the address does not change while running).
let lastAppUrl: string | undefined
let lastHttps = false
