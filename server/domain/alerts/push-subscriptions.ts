import type { User } from '../../db/schema'
import { and, asc, eq, schema, transaction, useDB } from '../../utils/db'
import { conflict, notFound, unavailable } from '../../utils/errors'
import { isDuplicateKeyError } from '../../utils/idempotency'
import { pushStandinUrl } from '../standins/push-device'
import { standinsEnabled } from './standins'

export type PushSubscriptionInput = { endpoint: string, keys: { p256dh: string, auth: string }, label?: string }

const taken = () => conflict('This push endpoint is registered to another account; nothing was changed',
  [{ field: 'endpoint', message: 'is registered to another account' }])

/**
 * Registers a browser's Push API subscription for the user. An endpoint belongs to one user: the same browser
 * registering again updates its keys; another user's endpoint is 409.
 */
export async function registerPushSubscription(user: User, input: PushSubscriptionInput) {
  const p = schema.pushSubscriptions
  const { endpoint, keys, label } = input
  const values = { p256dh: keys.p256dh, auth: keys.auth, label: label || 'Browser' }
  const row = await transaction(async (tx) => {
    const [existing] = await tx.select().from(p).where(eq(p.endpoint, endpoint)).for('update')
    if (existing && existing.userId !== user.id) throw taken()
    if (existing) {
      await tx.update(p).set(values).where(and(eq(p.id, existing.id), eq(p.userId, user.id)))
      return { ...existing, ...values }
    }
    const [made] = await tx.insert(p).values({ userId: user.id, endpoint, ...values }).$returningId()
    return { id: made!.id, ...values }
  }).catch((err) => {
    // Two accounts registering the same endpoint at once: the unique index lets one in.
    if (isDuplicateKeyError(err)) throw taken()
    throw err
  })
  return { id: row.id, label: row.label, endpoint }
}

export async function pushSubscriptionsOf(userId: number) {
  const p = schema.pushSubscriptions
  return useDB().select({ id: p.id, label: p.label, endpoint: p.endpoint, createdAt: p.createdAt }).from(p).where(eq(p.userId, userId)).orderBy(asc(p.id))
}

export async function removePushSubscription(userId: number, id: number) {
  const p = schema.pushSubscriptions
  const [result] = await useDB().delete(p).where(and(eq(p.id, id), eq(p.userId, userId)))
  if (!result.affectedRows) throw notFound(`No push subscription #${id} of yours`)
}

function requireStandins() {
  if (!standinsEnabled()) throw notFound('There is no push-service stand-in in production')
}

/**
 * A simulated device: the local push-service stand-in issues a subscription (keeping its private key so it can
 * decrypt what arrives) and it is saved as one of the user's push subscriptions. Only where the stand-ins run.
 */
export async function makeSimulatedDevice(user: User, label: string) {
  requireStandins()
  let issued: { id: string, endpoint: string, keys: { p256dh: string, auth: string } }
  try {
    const res = await fetch(`${pushStandinUrl()}/subscriptions`, { method: 'POST', body: JSON.stringify({ label: `${label} (${user.email})` }), signal: AbortSignal.timeout(5000) })
    if (res.status !== 201) throw new Error(`answered ${res.status}`)
    issued = await res.json()
  }
  catch (err) {
    throw unavailable(`The local push-service stand-in at ${pushStandinUrl()} is not answering (${(err as Error).message}); start it with npm start`)
  }
  const [row] = await useDB().insert(schema.pushSubscriptions).values({ userId: user.id, endpoint: issued.endpoint, p256dh: issued.keys.p256dh, auth: issued.keys.auth, label }).$returningId()
  return { id: row!.id, label, endpoint: issued.endpoint, standinId: issued.id }
}

/** What the push-service stand-in received (verified and decrypted) for the user's simulated devices. */
export async function simulatedDeliveriesOf(userId: number) {
  requireStandins()
  const p = schema.pushSubscriptions
  const mine = await useDB().select({ id: p.id, label: p.label, endpoint: p.endpoint }).from(p).where(eq(p.userId, userId))
  const base = pushStandinUrl()
  const simulated = mine.filter(s => s.endpoint.startsWith(`${base}/push/`))
  const ids = new Set(simulated.map(s => s.endpoint.slice(`${base}/push/`.length)))
  let messages: { subscriptionId: string }[] = []
  let reachable = true
  try {
    // Only this user's devices, newest first, one page (the stand-in keeps every message of a run).
    if (ids.size) {
      const query = new URLSearchParams({ subscription: [...ids].join(','), pageSize: '200' })
      const res = await fetch(`${base}/messages?${query}`, { signal: AbortSignal.timeout(5000) })
      messages = (await res.json()).messages
    }
    else await fetch(`${base}/healthz`, { signal: AbortSignal.timeout(5000) })
  }
  catch {
    reachable = false
  }
  return {
    standin: base, reachable,
    devices: simulated.map(s => ({ id: s.id, label: s.label, endpoint: s.endpoint })),
    messages: messages.filter(m => ids.has(m.subscriptionId)),
  }
}
