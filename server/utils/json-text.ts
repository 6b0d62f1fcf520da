import type { H3Event } from 'h3'
import { gzipSync, constants } from 'node:zlib'
import { BoundedCache } from '../domain/briefings/analysis-cache'

/** Answers under this size go as they are: compressing them saves less than it costs. */
export const GZIP_MIN_BYTES = 1024

// The last compressed copy of each answer (by the key of its shared read, server/utils/shared-read.ts): while the
// text stays the same (times in answers go to the second), every request of every read reuses it. Bounded.
const MEMO_MAX = 500
const compressed = new Map<string, { text: string, body: Buffer }>()

// What each Accept-Encoding text said (a client sends the same one on every request), bounded.
const gzipVerdicts = new BoundedCache<{ gzip: boolean, bytes: number }>(64, 64 * 256)

/**
 * Whether Accept-Encoding accepts gzip (RFC 9110 §12.5.3): gzip listed with a weight above 0, or else "*" with one;
 * browsers send "gzip, deflate, br, zstd".
 */
export function acceptsGzip(header: string | undefined): boolean {
  if (!header) return false
  const known = gzipVerdicts.peek(header)
  if (known) return known.gzip
  const gzip = gzipVerdictOf(header)
  if (header.length <= 256) gzipVerdicts.set(header, { gzip, bytes: header.length })
  return gzip
}

function gzipVerdictOf(header: string): boolean {
  const weights = new Map<string, number>()
  for (const part of header.split(',')) {
    const [name, ...params] = part.split(';').map(x => x.trim().toLowerCase())
    if (!name) continue
    const q = params.find(p => p.startsWith('q='))
    weights.set(name, q === undefined ? 1 : Number(q.slice(2)) || 0)
  }
  const w = weights.get('gzip') ?? weights.get('x-gzip') ?? weights.get('*')
  return w !== undefined && w > 0
}

/**
 * Sends JSON text (already serialised, often shared by several requests) with its type; gzip-compressed when the
 * client accepts it and the text is not small, compressed once while the text under `memoKey` stays the same.
 * Returns what the handler answers.
 */
export function jsonText(event: H3Event, memoKey: string, text: string): string | Buffer {
  setResponseHeader(event, 'content-type', 'application/json; charset=utf-8')
  setResponseHeader(event, 'vary', 'accept-encoding')
  if (text.length < GZIP_MIN_BYTES || !acceptsGzip(event.node.req.headers['accept-encoding'])) return text
  let kept = compressed.get(memoKey)
  // The same text made again by the next shared read is compared in full once, then held as this very string: the
  // other requests of that read compare by identity.
  if (kept && kept.text === text) kept.text = text
  else {
    // Level 4: most of level 9's saving on JSON for a fraction of its time.
    kept = { text, body: gzipSync(text, { level: 4, strategy: constants.Z_DEFAULT_STRATEGY }) }
    compressed.delete(memoKey)
    compressed.set(memoKey, kept)
    while (compressed.size > MEMO_MAX) compressed.delete(compressed.keys().next().value as string)
  }
  setResponseHeader(event, 'content-encoding', 'gzip')
  return kept.body
}
