/**
 * Answers kept while nothing they show has changed. Triggers count every change per airfield in airfield_versions
 * (server/db/schema/versions.ts); an answer is kept with the counters read in the same statement as its data and
 * the moment its time-bound content runs out (a profile's validity ending, the next one beginning, a supersession
 * starting or ending). A later read first asks only the counters (one indexed read per airfield shown): the same
 * counters and time not run out give the kept answer; any change, on any instance or node, gives a new read.
 */
import { BoundedCache } from '../briefings/analysis-cache'

/** SQL: the counter of the airfield whose id is in `idColumn` (0 where none was kept yet). */
export const versionOfSql = (idColumn: string) => `IFNULL((SELECT av.version FROM airfield_versions av WHERE av.airfield_id = ${idColumn}), 0)`
/** SQL: the counter of the organisation's limits, which every airfield's checks read. */
export const ORG_VERSION_SQL = 'IFNULL((SELECT av.version FROM airfield_versions av WHERE av.airfield_id = 0), 0)'

/** The earliest of the given instants still after `now` (ms since the epoch), or Infinity when none is. */
export function nextChangeMs(now: Date, ...instants: (Date | null | undefined)[]): number {
  let next = Number.POSITIVE_INFINITY
  for (const d of instants) {
    const t = d?.getTime()
    if (t != null && t > now.getTime() && t < next) next = t
  }
  return next
}

export type Kept<V> = { value: V, versions: string, untilMs: number, bytes: number }

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

  /** The kept answer for `key` whatever its counters (to know what to ask them for). */
  peekValue(key: string): V | undefined {
    return this.cache.peek(key)?.value
  }

  /** The kept answer for `key` if it was read at exactly these counters and has not run out at `now`. */
  get(key: string, versions: string, now: Date): V | undefined {
    const k = this.cache.get(key)
    return k && k.versions === versions && now.getTime() < k.untilMs ? k.value : undefined
  }

  set(key: string, value: V, versions: string, untilMs: number, bytes: number) {
    this.cache.set(key, { value, versions, untilMs, bytes })
  }

  get hits() { return this.cache.hits }
  get size() { return this.cache.size }
  clear() { this.cache.clear() }
}

/** One text for the counters of the rows an answer shows (their order included) and of the organisation's limits. */
export function countersOf(rows: { id: number, v: number | string, followed?: number | string }[], org: number | string, total: number | string) {
  return `${total}|${org}|${rows.map(r => `${r.id}:${r.followed ?? 0}:${r.v}`).join(',')}`
}
