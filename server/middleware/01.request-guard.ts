import type { H3Event } from 'h3'
import type { IncomingMessage } from 'node:http'

// Every /api/ request passes here before its route: answers are never cached, and a write must come from our own
// origin (unless it is a feed's bearer-token request without a session cookie). Its body, when the route reads it
// (after checking who is asking), must be of a type the route takes (415), stay under the route's size (413, before
// the body is read in full; at once when the declared length says so) and nest its JSON at most JSON_MAX_DEPTH deep
// (422); a leading byte order mark is dropped.
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

  const limit = bodyLimitFor(pathname)
  const tooLarge = () => {
    drainAndDrop(event.node.req)
    return createError({ statusCode: 413, statusMessage: `The request body is larger than the limit of ${formatBytes(limit)} for this route` })
  }
  // A declared length over the limit is refused at once, whoever asks: nothing of the body is read.
  if (declared !== null && (!Number.isFinite(declared) || declared > limit)) throw tooLarge()

  // The rest waits until the route reads its body, i.e. after it has checked who is asking (401 and 403 first).
  const type = mediaType(headers['content-type'])
  let reading: Promise<Buffer> | undefined
  const read = async (): Promise<Buffer> => {
    const accepted = acceptedBodyTypes(pathname)
    if (!accepted.some(t => t === type || (t === 'application/json' && isJsonType(type)))) {
      drainAndDrop(event.node.req)
      throw createError({ statusCode: 415, statusMessage: `Send the body as ${accepted.join(' or ')} (Content-Type was ${type || 'missing'})` })
    }
    const raw = await readCapped(event.node.req, limit).catch(() => {
      throw createError({ statusCode: 400, statusMessage: 'The request body did not arrive whole; send it again' })
    })
    if (raw === null) {
      // Answer once the rest has arrived (at most 5 s): an answer sent while the client is still sending is lost when
      // the closed socket resets the connection under it.
      const refusal = tooLarge()
      await drained(event.node.req, DRAIN_MAX_MS)
      throw refusal
    }
    const body = stripBom(raw)
    if (isJsonType(type) && jsonDepth(body.toString('utf8'), JSON_MAX_DEPTH) > JSON_MAX_DEPTH) {
      throw createError({
        statusCode: 422,
        statusMessage: `The JSON body nests deeper than ${JSON_MAX_DEPTH} levels; nothing was saved`,
        data: { issues: [{ field: '(body)', message: `nests deeper than ${JSON_MAX_DEPTH} levels of arrays and objects` }] },
      })
    }
    return body
  }
  // h3's readRawBody and readBody take the body from here (a thenable: nothing is read until a route asks).
  const lazyBody = {
    then<A, B>(ok: (b: Buffer) => A | PromiseLike<A>, fail?: (e: unknown) => B | PromiseLike<B>) {
      reading ??= read()
      return reading.then(ok, fail)
    },
  }
  ;(event as unknown as { _requestBody?: unknown })._requestBody = lazyBody
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

/**
 * Lets the rest of a refused body arrive and drops it, so the client can read the answer (closing a socket with
 * unread data makes TCP reset the connection, and the answer is lost); at most 5 s of it.
 */
function drainAndDrop(req: IncomingMessage) {
  req.removeAllListeners('data')
  req.resume()
  const timer = setTimeout(() => req.socket?.destroy(), DRAIN_MAX_MS)
  timer.unref()
  req.once('end', () => clearTimeout(timer))
}

const DRAIN_MAX_MS = 5000

/** Resolves when the request has been read to its end, or closed, or after `maxMs`. */
function drained(req: IncomingMessage, maxMs: number): Promise<void> {
  if (req.readableEnded || req.destroyed) return Promise.resolve()
  return new Promise((resolve) => {
    const timer = setTimeout(resolve, maxMs)
    timer.unref()
    const done = () => {
      clearTimeout(timer)
      resolve()
    }
    req.once('end', done)
    req.once('close', done)
  })
}

/** The whole body, or null as soon as it grows past `limit` (what follows is dropped, not kept). */
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
      if (size > limit) finish(null)
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
