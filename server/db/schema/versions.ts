import { mysqlTable, int, bigint } from 'drizzle-orm/mysql-core'

// A counter per airfield of every change to what its lists and briefings show: its row, runways and ends, profiles and
// their supersessions, its limit sets and who follows it. Kept by triggers (migrations/0006), so no write path, on
// any instance or node, can forget it; airfield_id 0 counts the organisation's limits, which apply to every airfield.
// airfield_id -1 counts the set of airfields itself: one added, removed or changed (migrations/0007).
// A reader holding an answer made at version n may serve it again while the counter still says n (and nothing
// time-bound in it has run out): checking costs one indexed read, not the whole query.
export const airfieldVersions = mysqlTable('airfield_versions', {
  airfieldId: int('airfield_id').primaryKey(),
  version: bigint('version', { mode: 'number' }).notNull().default(0),
})

// A counter per user of every change to which airfields they follow (kept by triggers on alert_subscriptions,
// migrations/0007). With the set counter (airfield_versions row -1: an airfield added, removed, renamed or recoded),
// it tells a reader holding a page of a list that the page still holds the same airfields in the same order, so that
// only the counters of the page's own airfields need asking.
export const followVersions = mysqlTable('follow_versions', {
  userId: int('user_id').primaryKey(),
  version: bigint('version', { mode: 'number' }).notNull().default(0),
})

// One counter of every change anywhere that any list or briefing shows: bumped by triggers whenever a row of
// airfield_versions is (migrations/0008). Read with every session, it tells a route holding an answer confirmed at
// version n that nothing at all changed since, so that even its airfield's counters need not be asked.
export const dataVersions = mysqlTable('data_versions', {
  id: int('id').primaryKey(),
  version: bigint('version', { mode: 'number' }).notNull().default(0),
})

// A counter per user of every change to their briefing receipts (kept by triggers on briefing_receipts,
// migrations/0008), read with every session beside the data counter: a kept briefing shows the reader's receipt.
export const readerVersions = mysqlTable('reader_versions', {
  userId: int('user_id').primaryKey(),
  version: bigint('version', { mode: 'number' }).notNull().default(0),
})
