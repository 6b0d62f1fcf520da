import type { H3Event } from 'h3'
import type { IncomingMessage } from 'node:http'

// Every /api/ request passes here before its route: answers are never cached, and a write must come from our own
// origin (unless it is a feed's bearer-token request without a session cookie), declare a body type the route
// takes, stay under the route's size (refused with 413 before the body is read in full), and nest its JSON at most
// JSON_MAX_DEPTH deep. The body read here (without a byte order mark) is what the route reads again.
const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

export default defineEventHandler(async (event) => {
  if (isHttpsDeployment()) setResponseHeader(event, 'Strict-Transport-Security', 'max-age=15552000; includeSubDomains')
  const pathname = event.path.split('?')[0]!
  if (!pathname.startsWith('/api/')) return
  // JSON is never a page: nothing may run, frame or cache it.
  setResponseHeader(event, 'Cache-Control', 'no-store')
  setResponseHeader(event, 'Content-Security-Policy', 'default-src \'none\'; frame-ancestors \'none\'')
  if (!UNSAFE.has(event.method)) return

  const headers = event.node.req.headers
  const bearer = /^bearer\s/i.test(String(headers.authorization ?? ''))
  const sessionCookie = Boolean(parseCookies(event)['nuxt-session'])
  if (!bearer || sessionCookie) {
    const verdict = originVerdict({ origin: headers.origin, secFetchSite: headerText(headers['sec-fetch-site']) }, ownOrigins(event))
    if (!verdict.ok) throw createError({ statusCode: 403, statusMessage: verdict.message })
  }

  const declared = headers['content-length'] === undefined ? null : Number(headers['content-length'])
  const chunked = /\bchunked\b/i.test(String(headers['transfer-encoding'] ?? ''))
  if (!chunked && (declared === null || declared === 0)) return

  const type = mediaType(headers['content-type'])
  const accepted = acceptedBodyTypes(pathname)
  if (!accepted.some(t => t === type || (t === 'application/json' && isJsonType(type)))) {
    throw createError({
      statusCode: 415,
      statusMessage: `Send the body as ${accepted.join(' or ')} (Content-Type was ${type || 'missing'})`,
    })
  }

  const limit = bodyLimitFor(pathname)
  const tooLarge = () => {
    setResponseHeader(event, 'Connection', 'close')
    event.node.req.resume()
    setTimeout(() => event.node.req.socket?.destroy(), 5000).unref()
    return createError({ statusCode: 413, statusMessage: `The request body is larger than the limit of ${formatBytes(limit)} for this route` })
  }
  if (declared !== null && (!Number.isFinite(declared) || declared > limit)) throw tooLarge()
  const raw = await readCapped(event.node.req, limit).catch(() => {
    throw createError({ statusCode: 400, statusMessage: 'The request body did not arrive whole; send it again' })
  })
  if (raw === null) throw tooLarge()
  const body = stripBom(raw)
  if (isJsonType(type) && jsonDepth(body.toString('utf8'), JSON_MAX_DEPTH) > JSON_MAX_DEPTH) {
    throw createError({
      statusCode: 422,
      statusMessage: `The JSON body nests deeper than ${JSON_MAX_DEPTH} levels; nothing was saved`,
      data: { issues: [{ field: '(body)', message: `nests deeper than ${JSON_MAX_DEPTH} levels of arrays and objects` }] },
    })
  }
  // h3's readRawBody and readBody take a body already read from here.
  ;(event as unknown as { _requestBody?: Buffer })._requestBody = body
})

function headerText(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value
}

/** Our own origins: the configured public address, and the one this request was sent to. */
function ownOrigins(event: H3Event): string[] {
  const trust = process.env.VEERLINE_TRUST_PROXY === '1'
  const own = getRequestURL(event, { xForwardedHost: trust, xForwardedProto: trust }).origin.toLowerCase()
  const configured = originOf(process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig(event).public.appUrl)
  return configured ? [own, configured] : [own]
}

function formatBytes(n: number) {
  return n >= 1024 * 1024 ? `${(n / 1024 / 1024).toFixed(0)} MB` : `${(n / 1024).toFixed(0)} KB`
}

/** The whole body, or null as soon as it grows past `limit` (the rest is not read). */
function readCapped(req: IncomingMessage, limit: number): Promise<Buffer | null> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    let settled = false
    const finish = (value: Buffer | null) => {
      if (settled) return
      settled = true
      req.off('data', onData)
      resolve(value)
    }
    const onData = (chunk: Buffer) => {
      size += chunk.length
      if (size > limit) {
        // Nothing more is kept; what is still on its way is let through and dropped, so the client can read the
        // 413 (closing on unread data makes TCP reset the connection before the answer arrives). At most 5 s of it.
        req.off('data', onData)
        req.resume()
        setTimeout(() => req.socket?.destroy(), 5000).unref()
        finish(null)
      }
      else chunks.push(chunk)
    }
    req.on('data', onData)
    req.on('end', () => finish(Buffer.concat(chunks)))
    req.on('error', (err) => {
      if (!settled) {
        settled = true
        reject(err)
      }
    })
  })
}
