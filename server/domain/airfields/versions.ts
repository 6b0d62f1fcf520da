/**
 * Answers kept while nothing they show has changed. Triggers count every change per airfield in airfield_versions
 * (server/db/schema/versions.ts); an answer is kept with the counters read in the same statement as its data and
 * the moment its time-bound content runs out (a profile's validity ending, the next one beginning, a supersession
 * starting or ending). A later read first asks only the counters (one indexed read per airfield shown): the same
 * counters and time not run out give the kept answer; any change, on any instance or node, gives a new read.
 *
 * A page of a list is kept with two more counters: the set of airfields (one added, removed, recoded or renamed) and
 * the reader's follows. While both stand, the same search finds the same airfields in the same order, so checking the
 * page asks only for its own airfields' counters (one primary-key read each), however many airfields there are.
 */
import { BoundedCache } from '../briefings/analysis-cache'
import { usePool } from '../../utils/db'

/** SQL: the counter of the airfield whose id is in `idColumn` (0 where none was kept yet). */
export const versionOfSql = (idColumn: string) => `IFNULL((SELECT av.version FROM airfield_versions av WHERE av.airfield_id = ${idColumn}), 0)`
/** SQL: the counter of the organisation's limits, which every airfield's checks read. */
export const ORG_VERSION_SQL = 'IFNULL((SELECT av.version FROM airfield_versions av WHERE av.airfield_id = 0), 0)'
/** SQL: the counter of the set of airfields (migrations/0007). */
export const SET_VERSION_SQL = 'IFNULL((SELECT av.version FROM airfield_versions av WHERE av.airfield_id = -1), 0)'
/** SQL: the follow counter of the user whose id is the placeholder's value (0 for none, or one who never followed). */
export const FOLLOW_VERSION_SQL = 'IFNULL((SELECT fv.version FROM follow_versions fv WHERE fv.user_id = ?), 0)'

const SET_ID = -1
const ORG_ID = 0

/** The earliest of the given instants still after `now` (ms since the epoch), or Infinity when none is. */
export function nextChangeMs(now: Date, ...instants: (Date | null | undefined)[]): number {
  let next = Number.POSITIVE_INFINITY
  for (const d of instants) {
    const t = d?.getTime()
    if (t != null && t > now.getTime() && t < next) next = t
  }
  return next
}

/**
 * `confirmedAt`: the read stamp (server/domain/accounts/session-store.ts) of a session read made before the answer
 * was last read or found still standing. A request whose own session read gave that same stamp knows nothing changed
 * anywhere since, so the answer stands for it with no query at all.
 */
export type Kept<V> = { value: V, versions: string, untilMs: number, bytes: number, ids: number[], confirmedAt: string | null }

/** A bounded store of answers, each with the counters it was read at and when it runs out. */
export class KeptAnswers<V> {
  private cache: BoundedCache<Kept<V>>
  constructor(maxEntries: number, maxBytes = 16 * 1024 * 1024) {
    this.cache = new BoundedCache<Kept<V>>(maxEntries, maxBytes)
  }

  /** Whether an answer is kept for `key` (then its counters are worth asking). */
  has(key: string) {
    return this.cache.peek(key) !== undefined
  }

  /** The airfields a kept answer shows, in its order (to ask only their counters). */
  idsOf(key: string): number[] {
    return this.cache.peek(key)?.ids ?? []
  }

  /** The kept answer for `key` whatever its counters (to know what to ask them for). */
  peekValue(key: string): V | undefined {
    return this.cache.peek(key)?.value
  }

  /** The kept answer for `key` if it was read at exactly these counters and has not run out at `now`. */
  get(key: string, versions: string, now: Date): V | undefined {
    const k = this.cache.get(key)
    return k && k.versions === versions && now.getTime() < k.untilMs ? k.value : undefined
  }

  /** The kept answer for `key` if it was confirmed at exactly this read stamp and has not run out at `now`. */
  confirmed(key: string, stamp: string | null, now: Date): V | undefined {
    if (stamp === null) return undefined
    const k = this.cache.get(key)
    return k && k.confirmedAt === stamp && now.getTime() < k.untilMs ? k.value : undefined
  }

  /**
   * Marks the kept answer for `key` as standing at `stamp`, the stamp of a session read made before the check that
   * found it standing (and its value as now read, when given).
   */
  confirm(key: string, stamp: string | null, value?: V) {
    const k = this.cache.peek(key)
    if (!k) return
    k.confirmedAt = stamp
    if (value !== undefined) k.value = value
  }

  /** Keeps an answer read at `versions`; `stamp`: the read stamp of a session read made before this read. */
  set(key: string, value: V, versions: string, untilMs: number, bytes: number, ids: number[] = [], stamp: string | null = null) {
    this.cache.set(key, { value, versions, untilMs, bytes, ids, confirmedAt: stamp })
  }

  get hits() { return this.cache.hits }
  get size() { return this.cache.size }
  clear() { this.cache.clear() }
}

/** The counters a page of a list was read at, in one text: set, reader's follows, organisation, then each row's. */
export type PageVersions = { set: number | string, follow: number | string, org: number | string, rows: { id: number, v: number | string }[] }

export function pageCountersOf(p: PageVersions): string {
  return `${p.set}|${p.follow}|${p.org}|${p.rows.map(r => `${r.id}:${r.v}`).join(',')}`
}

/**
 * The counters, as they stand, of a kept page that showed the airfields `ids` (in that order) to `followerId`, in one
 * query of primary-key reads: equal to pageCountersOf of a full read made now exactly when nothing it shows changed.
 */
export async function pageCountersNow(ids: number[], followerId: number | undefined): Promise<string> {
  // A prepared statement per page size (the same text for every page of that size): parsed and planned once per
  // connection.
  const keys = [SET_ID, ORG_ID, ...ids]
  const [rows] = await usePool().execute(
    `SELECT av.airfield_id AS id, av.version AS v FROM airfield_versions av WHERE av.airfield_id IN (${keys.map(() => '?').join(',')})
     UNION ALL SELECT NULL AS id, fv.version AS v FROM follow_versions fv WHERE fv.user_id = ?`,
    [...keys, followerId ?? null],
  ) as [{ id: number | null, v: number | string }[], unknown]
  const v = new Map<number, string>()
  let follow = '0'
  for (const r of rows) {
    if (r.id == null) follow = String(r.v)
    else v.set(Number(r.id), String(r.v))
  }
  return pageCountersOf({ set: v.get(SET_ID) ?? 0, follow, org: v.get(ORG_ID) ?? 0, rows: ids.map(id => ({ id, v: v.get(id) ?? 0 })) })
}
