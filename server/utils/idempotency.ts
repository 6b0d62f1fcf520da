import type { H3Event } from 'h3'
import type { FilingActor } from '../domain/profiles/filing'
import { and, eq, schema, useDB } from './db'
import type { Tx } from './db'
import { invalid } from './errors'
import { sha256Hex } from '../domain/accounts/api-tokens'

export type IdempotencyClaim = { scope: string, key: string, route: string, requestHash: string }

/** The Idempotency-Key of a request (1 to 200 visible characters), or null without one. */
export function idempotencyClaim(event: H3Event, actor: FilingActor, rawBody: string): IdempotencyClaim | null {
  const key = getHeader(event, 'idempotency-key')?.trim()
  if (key === undefined || key === '') return null
  if (key.length > 200 || !/^[\x21-\x7e]+$/.test(key)) {
    throw invalid([{ field: 'Idempotency-Key', message: 'must be 1 to 200 visible ASCII characters' }], 'Idempotency-Key must be 1 to 200 visible ASCII characters')
  }
  const scope = actor.token ? `token:${actor.token.id}` : `user:${actor.user.id}`
  const { path, query } = normalisedTarget(event.path)
  const route = `${event.method} ${path}`.slice(0, 200)
  // The method, the path, the query and the body all make the request: the same key with any of them changed is
  // a different request (422), not a replay.
  return { scope, key, route, requestHash: sha256Hex(`${event.method}\n${path}\n${query}\n${rawBody}`) }
}

/**
 * The path and query of a request as one resource: percent-decoding undone where safe, repeated and trailing slashes
 * dropped, letters in lower case (codes and ids are not case-sensitive), query parameters sorted by name.
 */
export function normalisedTarget(target: string): { path: string, query: string } {
  const [rawPath = '', rawQuery = ''] = target.split(/\?(.*)/s, 2)
  let path = rawPath
  try {
    path = decodeURIComponent(rawPath)
  }
  catch { /* keep it as sent */ }
  path = path.replace(/\/{2,}/g, '/').replace(/(.)\/$/, '$1').toLowerCase()
  const params = [...new URLSearchParams(rawQuery)].sort(([a, av], [b, bv]) => (a < b ? -1 : a > b ? 1 : av < bv ? -1 : av > bv ? 1 : 0))
  return { path, query: new URLSearchParams(params).toString() }
}

/** The first answer to this key, when there is one; 422 when the key was used for a different request. */
export async function storedAnswer(claim: IdempotencyClaim) {
  const [row] = await useDB().select().from(schema.idempotencyKeys)
    .where(and(eq(schema.idempotencyKeys.scope, claim.scope), eq(schema.idempotencyKeys.idemKey, claim.key)))
  if (!row) return null
  if (row.requestHash !== claim.requestHash || row.route !== claim.route) {
    throw invalid([{ field: 'Idempotency-Key', message: 'was already used for a different request' }], 'This Idempotency-Key was already used for a different request; send a new key')
  }
  return { status: row.responseStatus, body: row.responseBody }
}

/** Keeps the answer with the change, in the same transaction. A concurrent twin fails on the unique key. */
export async function storeAnswer(tx: Tx, claim: IdempotencyClaim, status: number, body: unknown) {
  await tx.insert(schema.idempotencyKeys).values({
    scope: claim.scope, idemKey: claim.key, route: claim.route, requestHash: claim.requestHash,
    responseStatus: status, responseBody: body,
  })
}

export function isDuplicateKeyError(err: unknown): boolean {
  const e = err as { code?: string, cause?: { code?: string } }
  return e?.code === 'ER_DUP_ENTRY' || e?.cause?.code === 'ER_DUP_ENTRY'
}

/**
 * Runs a write once per Idempotency-Key: a repeated request (or a twin that lost the race on the unique key) gets
 * the first answer again with `Idempotent-Replayed: true`; `run` stores its answer in its own transaction. The answer
 * stored for a key is the one `run` returned for it, so a replay has its type.
 */
export async function onceForKey<T>(event: H3Event, claim: IdempotencyClaim | null, run: () => Promise<T>): Promise<T> {
  const replay = async () => {
    const first = claim && await storedAnswer(claim)
    if (!first) return null
    setResponseStatus(event, first.status)
    setHeader(event, 'Idempotent-Replayed', 'true')
    return first.body as T
  }
  const replayed = await replay()
  if (replayed) return replayed
  try {
    return await run()
  }
  catch (err) {
    if (claim && isDuplicateKeyError(err)) {
      const again = await replay()
      if (again) return again
    }
    throw err
  }
}
