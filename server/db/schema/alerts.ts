import { mysqlTable, int, bigint, tinyint, varchar, datetime, double, text, mediumtext, mysqlEnum, boolean, json, uniqueIndex, index } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { airfields } from './airfields'
import { profiles } from './profiles'
import { users } from './users'

const at = (name: string) => datetime(name, { mode: 'date', fsp: 3 })
const now = sql`CURRENT_TIMESTAMP(3)`

/** The limit values a set may hold; null in an override means "inherit from the level above". */
export type LimitValues = {
  maxCrosswindKt: number | null
  maxTailwindKt: number | null
  maxLayerShearKtPer100ft: number | null
  maxVectorDiff600mKt: number | null
  maxAirspeedLossKt: number | null
  maxFFactor: number | null
  nearLimitMarginPct: number | null
}

// Limit sets: one organisation default (scope 'org'), per-airfield overrides ('airfield:<id>') and
// per-runway-end overrides ('airfield:<id>:<designator>'). Null values inherit.
export const thresholdSets = mysqlTable('threshold_sets', {
  id: int('id').autoincrement().primaryKey(),
  scopeKey: varchar('scope_key', { length: 40 }).notNull(),
  airfieldId: int('airfield_id').references(() => airfields.id),
  designator: varchar('designator', { length: 3 }),
  maxCrosswindKt: double('max_crosswind_kt'),
  maxTailwindKt: double('max_tailwind_kt'),
  maxLayerShearKtPer100ft: double('max_layer_shear_kt_per_100ft'),
  maxVectorDiff600mKt: double('max_vector_diff_600m_kt'),
  maxAirspeedLossKt: double('max_airspeed_loss_kt'),
  maxFFactor: double('max_f_factor'),
  nearLimitMarginPct: double('near_limit_margin_pct'),
  updatedByUserId: int('updated_by_user_id').references(() => users.id),
  updatedAt: at('updated_at').notNull().default(now),
}, t => [uniqueIndex('threshold_sets_scope').on(t.scopeKey), index('threshold_sets_airfield').on(t.airfieldId)])

// Every change of a limit set: who, when, why, the values before and after. Only ever inserted.
export const thresholdChanges = mysqlTable('threshold_changes', {
  id: int('id').autoincrement().primaryKey(),
  scopeKey: varchar('scope_key', { length: 40 }).notNull(),
  airfieldId: int('airfield_id').references(() => airfields.id),
  designator: varchar('designator', { length: 3 }),
  changedByUserId: int('changed_by_user_id').notNull().references(() => users.id),
  changedAt: at('changed_at').notNull().default(now),
  reason: varchar('reason', { length: 500 }).notNull(),
  oldValues: json('old_values').$type<LimitValues | null>(),
  newValues: json('new_values').$type<LimitValues>().notNull(),
}, t => [index('threshold_changes_scope').on(t.scopeKey, t.changedAt)])

export const alertStates = ['active', 'cleared', 'superseded', 'expired'] as const

// One row per crossing: (profile version, runway end, kind) is unique. designator '' = airfield-wide figure.
export const alerts = mysqlTable('alerts', {
  id: int('id').autoincrement().primaryKey(),
  airfieldId: int('airfield_id').notNull().references(() => airfields.id),
  profileId: int('profile_id').notNull().references(() => profiles.id),
  designator: varchar('designator', { length: 3 }).notNull(),
  kind: varchar('kind', { length: 32 }).notNull(),
  value: double('value').notNull(),
  limitValue: double('limit_value').notNull(),
  unit: varchar('unit', { length: 16 }).notNull(),
  excess: double('excess').notNull(),
  message: varchar('message', { length: 300 }).notNull(),
  state: mysqlEnum('state', alertStates).notNull().default('active'),
  // The alert of the profile this one's profile superseded, when the same crossing carried over.
  continuesAlertId: int('continues_alert_id'),
  raisedCount: int('raised_count').notNull().default(1),
  clearedAt: at('cleared_at'),
  clearReason: varchar('clear_reason', { length: 300 }),
  createdAt: at('created_at').notNull().default(now),
  updatedAt: at('updated_at').notNull().default(now),
}, t => [
  uniqueIndex('alerts_profile_end_kind').on(t.profileId, t.designator, t.kind),
  index('alerts_airfield_state').on(t.airfieldId, t.state),
])

// What each user follows: one row per (user, airfield) with the channels chosen. The in-app inbox is always on.
export const alertSubscriptions = mysqlTable('alert_subscriptions', {
  id: int('id').autoincrement().primaryKey(),
  userId: int('user_id').notNull().references(() => users.id),
  airfieldId: int('airfield_id').notNull().references(() => airfields.id),
  email: boolean('email').notNull().default(true),
  push: boolean('push').notNull().default(false),
  createdAt: at('created_at').notNull().default(now),
}, t => [uniqueIndex('alert_subscriptions_user_airfield').on(t.userId, t.airfieldId)])

// Push API subscriptions of a user's browsers or simulated devices.
export const pushSubscriptions = mysqlTable('push_subscriptions', {
  id: int('id').autoincrement().primaryKey(),
  userId: int('user_id').notNull().references(() => users.id),
  endpoint: varchar('endpoint', { length: 500 }).notNull(),
  p256dh: varchar('p256dh', { length: 120 }).notNull(),
  auth: varchar('auth', { length: 60 }).notNull(),
  label: varchar('label', { length: 120 }).notNull(),
  createdAt: at('created_at').notNull().default(now),
}, t => [uniqueIndex('push_subscriptions_endpoint').on(t.endpoint), index('push_subscriptions_user').on(t.userId)])

// The per-user inbox: one row per (user, alert, event); acknowledged by the user.
export const alertInbox = mysqlTable('alert_inbox', {
  id: int('id').autoincrement().primaryKey(),
  userId: int('user_id').notNull().references(() => users.id),
  alertId: int('alert_id').notNull().references(() => alerts.id),
  event: mysqlEnum('event', ['raised', 'cleared']).notNull(),
  title: varchar('title', { length: 300 }).notNull(),
  acknowledgedAt: at('acknowledged_at'),
  createdAt: at('created_at').notNull().default(now),
}, t => [index('alert_inbox_user').on(t.userId, t.acknowledgedAt)])

export const outboxKinds = ['alert-raised', 'alert-cleared', 'invitation', 'password-reset'] as const
export const outboxStates = ['queued', 'sent', 'failed'] as const
/** Claim order: alerts first, then all-clears, then invitations and resets (lower goes first). */
export const outboxPriority: Record<(typeof outboxKinds)[number], number> = { 'alert-raised': 0, 'alert-cleared': 1, 'invitation': 2, 'password-reset': 2 }
/** fan_seq of a row waiting for a retry: all retries share one lane, ordered by their next attempt. */
export const OUTBOX_RETRY_LANE = 1_000_000_000

// The transactional outbox: written with the change that causes it, sent by the in-app worker (server/domain/alerts/worker.ts).
// A worker claims due rows in a short transaction of its own: it writes its claim token, its name and a lease and
// moves next_attempt_at to the end of the lease, commits, then sends. A row whose lease ran out is due again.
export const outbox = mysqlTable('outbox', {
  id: bigint('id', { mode: 'number' }).autoincrement().primaryKey(),
  // Carried in every copy of the message (e-mail header X-Veerline-Delivery and Message-ID, push payload deliveryId):
  // a receiver that sees the same id twice drops the copy.
  deliveryId: varchar('delivery_id', { length: 36 }).notNull().default(sql`(uuid())`),
  kind: mysqlEnum('kind', outboxKinds).notNull(),
  channel: mysqlEnum('channel', ['email', 'push']).notNull(),
  priority: tinyint('priority').notNull().default(2),
  // The notice's place in its fan-out (0 for the first recipient, 1 for the next…; OUTBOX_RETRY_LANE once it failed
  // and waits for a retry). Claims take the lowest places first, so every airfield's first notices go before the
  // rest of a big fan-out (round-robin by place between the fan-outs that are under way).
  fanSeq: int('fan_seq').notNull().default(0),
  // Makes enqueueing idempotent: the same notice to the same target is queued once.
  dedupeKey: varchar('dedupe_key', { length: 160 }).notNull(),
  alertId: int('alert_id').references(() => alerts.id),
  airfieldId: int('airfield_id'),
  userId: int('user_id').references(() => users.id),
  pushSubscriptionId: int('push_subscription_id'),
  toAddress: varchar('to_address', { length: 254 }),
  subject: varchar('subject', { length: 300 }),
  textBody: mediumtext('text_body'),
  htmlBody: mediumtext('html_body'),
  pushPayload: json('push_payload').$type<Record<string, unknown>>(),
  state: mysqlEnum('state', outboxStates).notNull().default('queued'),
  attempts: int('attempts').notNull().default(0),
  nextAttemptAt: at('next_attempt_at').notNull().default(now),
  // The current (or last) claim: whose, under which token, until when.
  claimToken: varchar('claim_token', { length: 36 }),
  claimedBy: varchar('claimed_by', { length: 64 }),
  leaseUntil: at('lease_until'),
  firstAttemptAt: at('first_attempt_at'),
  lastError: text('last_error'),
  sentAt: at('sent_at'),
  sentBy: varchar('sent_by', { length: 64 }),
  createdAt: at('created_at').notNull().default(now),
  updatedAt: at('updated_at').notNull().default(now),
}, t => [
  uniqueIndex('outbox_dedupe').on(t.dedupeKey),
  uniqueIndex('outbox_delivery').on(t.deliveryId),
  // The claim reads this index in order and stops after a batch: state and priority equal, then by place in the
  // fan-out (fresh notices) or, in the retry lane, by next attempt.
  index('outbox_due').on(t.state, t.priority, t.fanSeq, t.nextAttemptAt),
  index('outbox_alert').on(t.alertId),
])

export const outboxAttemptOutcomes = ['sending', 'sent', 'error', 'released', 'lease-expired'] as const

// Every attempt at every delivery: who claimed it, when, and how it ended. 'sending' while in flight; 'released' when a
// stopping worker gave it back unsent; 'lease-expired' when the claimer vanished (it may or may not have gone out:
// the receiver can tell a copy by its delivery id).
export const outboxAttempts = mysqlTable('outbox_attempts', {
  id: bigint('id', { mode: 'number' }).autoincrement().primaryKey(),
  outboxId: bigint('outbox_id', { mode: 'number' }).notNull(),
  attempt: int('attempt').notNull(),
  claimToken: varchar('claim_token', { length: 36 }).notNull(),
  instance: varchar('instance', { length: 64 }).notNull(),
  claimedAt: at('claimed_at').notNull().default(now),
  finishedAt: at('finished_at'),
  outcome: mysqlEnum('outcome', outboxAttemptOutcomes).notNull().default('sending'),
  error: text('error'),
}, t => [index('outbox_attempts_outbox').on(t.outboxId, t.attempt)])

// Invitation and password-reset tokens: only a SHA-256 of the token is kept; single use; expiring.
export const userTokens = mysqlTable('user_tokens', {
  id: int('id').autoincrement().primaryKey(),
  userId: int('user_id').notNull().references(() => users.id),
  purpose: mysqlEnum('purpose', ['invitation', 'password-reset']).notNull(),
  tokenHash: varchar('token_hash', { length: 64 }).notNull(),
  expiresAt: at('expires_at').notNull(),
  usedAt: at('used_at'),
  createdByUserId: int('created_by_user_id').references(() => users.id),
  createdAt: at('created_at').notNull().default(now),
}, t => [uniqueIndex('user_tokens_hash').on(t.tokenHash), index('user_tokens_user').on(t.userId)])

export type ThresholdSet = typeof thresholdSets.$inferSelect
export type Alert = typeof alerts.$inferSelect
export type OutboxRow = typeof outbox.$inferSelect
export type OutboxAttempt = typeof outboxAttempts.$inferSelect
export type PushSubscriptionRow = typeof pushSubscriptions.$inferSelect
