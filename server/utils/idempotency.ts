import type { H3Event } from 'h3'
import type { FilingActor } from '../domain/profiles/filing'
import { and, eq, schema, useDB } from './db'
import type { Tx } from './db'
import { sha256Hex } from '../domain/accounts/api-tokens'

export type IdempotencyClaim = { scope: string, key: string, route: string, requestHash: string }

/** The Idempotency-Key of a request (1 to 200 visible characters), or null without one. */
export function idempotencyClaim(event: H3Event, actor: FilingActor, rawBody: string): IdempotencyClaim | null {
  const key = getHeader(event, 'idempotency-key')?.trim()
  if (key === undefined || key === '') return null
  if (key.length > 200 || !/^[\x21-\x7e]+$/.test(key)) {
    throw createError({ statusCode: 400, statusMessage: 'Idempotency-Key must be 1 to 200 visible ASCII characters' })
  }
  const scope = actor.token ? `token:${actor.token.id}` : `user:${actor.user.id}`
  return { scope, key, route: `${event.method} ${event.path.split('?')[0]}`, requestHash: sha256Hex(rawBody) }
}

/** The first answer to this key, when there is one; 422 when the key was used for a different request. */
export async function storedAnswer(claim: IdempotencyClaim) {
  const [row] = await useDB().select().from(schema.idempotencyKeys)
    .where(and(eq(schema.idempotencyKeys.scope, claim.scope), eq(schema.idempotencyKeys.idemKey, claim.key)))
  if (!row) return null
  if (row.requestHash !== claim.requestHash || row.route !== claim.route) {
    throw createError({ statusCode: 422, statusMessage: 'This Idempotency-Key was already used for a different request; send a new key' })
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
