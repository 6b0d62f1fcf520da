/**
 * The airfield list one page at a time, in one query: the page's airfields (a search on code or name, in code order)
 * with their runway end designators and the profile in force now and the next one, each found per airfield through
 * an index. A page costs the same however many airfields there are; the total comes with it.
 */
import type { Airfield } from '../../db/schema'
import { usePool } from '../../utils/db'
import { sharedRead } from '../../utils/shared-read'
import { airfieldSummary } from './index'
import { FOLLOW_VERSION_SQL, KeptAnswers, nextChangeMs, ORG_VERSION_SQL, pageCountersNow, pageCountersOf, SET_VERSION_SQL, versionOfSql } from './versions'

// A raw mysql2 row: its columns are typed where they are read.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Row = Record<string, any>

/** Which page of which airfields: `followerId` puts that user's followed airfields first (or only them). */
export type AirfieldPageOptions = { q: string, page: number, pageSize: number, followerId?: number, onlyFollowed?: boolean }

/** A LIKE pattern that finds the text anywhere, its wildcards taken literally. */
const containing = (q: string) => `%${q.replace(/[\\%_]/g, '\\$&')}%`

/**
 * The derived table `pg` (id, total, followed) of one page of airfields, and its placeholders' values. The window
 * count is taken before the limit: the number of airfields found, for the pager.
 */
export function airfieldPageSql(o: AirfieldPageOptions): { sql: string, args: unknown[] } {
  const follower = o.followerId != null
  const sql = `(SELECT f.id, f.code, COUNT(*) OVER () AS total, ${follower ? '(s.id IS NOT NULL)' : '0'} AS followed
    FROM airfields f ${follower ? 'LEFT JOIN alert_subscriptions s ON s.airfield_id = f.id AND s.user_id = ?' : ''}
    WHERE (? = '' OR f.code LIKE ? OR f.name LIKE ?) ${follower && o.onlyFollowed ? 'AND s.id IS NOT NULL' : ''}
    ORDER BY followed DESC, f.code LIMIT ? OFFSET ?) pg`
  const like = containing(o.q)
  return { sql, args: [...(follower ? [o.followerId] : []), o.q, like, like, o.pageSize, (o.page - 1) * o.pageSize] }
}

/** SQL select columns: the counters a page is read at besides its rows' (`setv`, `fv`, `org`); one placeholder, the reader. */
export const PAGE_VERSIONS_SQL = `${SET_VERSION_SQL} AS setv, ${FOLLOW_VERSION_SQL} AS fv, ${ORG_VERSION_SQL} AS org`

/** The counters of a page read in full: its rows as `{ id, v }` with the first row's `setv`, `fv` and `org`. */
export function pageCountersOfRead(rows: Row[], idOf: (r: Row) => number): string {
  const first = rows[0] ?? {}
  return pageCountersOf({ set: first.setv ?? 0, follow: first.fv ?? 0, org: first.org ?? 0, rows: rows.map(r => ({ id: idOf(r), v: r.v })) })
}

/**
 * A kept page of `kept` for `key`, if nothing it shows changed and nothing time-bound in it ran out: confirmed at the
 * request's data counter (`dataStamp`, read with its session: no query), or else found standing by asking only the
 * counters of the set of airfields, of the reader's follows and of the page's own airfields.
 */
export async function keptPage<V>(kept: KeptAnswers<V>, key: string, o: AirfieldPageOptions, now: Date, dataStamp: string | null): Promise<V | undefined> {
  if (!kept.has(key)) return undefined
  const confirmed = kept.confirmed(key, dataStamp, now)
  if (confirmed) return confirmed
  const standing = kept.get(key, await pageCountersNow(kept.idsOf(key), o.followerId), now)
  if (standing) kept.confirm(key, dataStamp)
  return standing
}

/** The page key of a kept answer. */
export const pageKeyOf = (o: AirfieldPageOptions) => `${o.followerId ?? ''}|${o.onlyFollowed ? 1 : 0}|${o.q}|${o.page}|${o.pageSize}`

/** How many airfields a search finds (when the page asked for lies past the last one, it carries no total). */
export async function countAirfieldPage(o: AirfieldPageOptions): Promise<number> {
  const page = airfieldPageSql({ ...o, page: 1, pageSize: 1 })
  const [rows] = await usePool().query(`SELECT pg.total FROM ${page.sql}`, page.args) as [Row[], unknown]
  return Number(rows[0]?.total ?? 0)
}

const brief = (id: number | null, validFrom: Date | null, validTo: Date | null, source: string | null) =>
  id == null ? null : { id, validFrom: validFrom!.toISOString(), validTo: validTo!.toISOString(), source: source! }

// In force now: the newest active one valid now (supersession by time); next: the earliest active one to begin.
// Each through the (airfield, status) index, for one airfield of the page.
const CURRENT_ID_SQL = `(SELECT q.id FROM profiles q WHERE q.airfield_id = a.id AND q.status = 'active'
    AND q.valid_from <= ? AND q.valid_to > ? ORDER BY q.id DESC LIMIT 1)`
const NEXT_ID_SQL = `(SELECT q.id FROM profiles q WHERE q.airfield_id = a.id AND q.status = 'active'
    AND q.valid_from > ? ORDER BY q.valid_from ASC, q.id ASC LIMIT 1)`

type AirfieldListPage = { airfields: ReturnType<typeof lineOf>[], total: number }
const keptPages = new KeptAnswers<AirfieldListPage>(2000)

function lineOf(r: Row) {
  const a: Airfield = {
    id: r.id, code: r.code, name: r.name, latitudeDeg: r.latitude_deg, longitudeDeg: r.longitude_deg, elevationM: r.elevation_m,
    elevationUnit: r.elevation_unit, magVarOverrideDeg: r.mag_var_override_deg, magVarOverrideReason: r.mag_var_override_reason,
    notes: r.notes, createdAt: r.created_at, updatedAt: r.updated_at,
    reportingStation: r.reporting_station, pathSettings: typeof r.path_settings === 'string' ? JSON.parse(r.path_settings) : (r.path_settings ?? null),
  }
  const cur = brief(r.c_id, r.c_valid_from, r.c_valid_to, r.c_source)
  const nxt = brief(r.n_id, r.n_valid_from, r.n_valid_to, r.n_source)
  return {
    ...airfieldSummary(a),
    runwayEnds: r.designators ? String(r.designators).split(',') : [],
    profileState: { state: cur ? 'current' as const : nxt ? 'upcoming' as const : 'none' as const, current: cur, next: nxt },
  }
}

/** One page of the airfield list: kept while its airfields' counters stand and no profile begins or ends. */
export async function readAirfieldList(o: AirfieldPageOptions, now = new Date(), dataStamp: string | null = null): Promise<AirfieldListPage> {
  const key = pageKeyOf(o)
  const kept = await keptPage(keptPages, key, o, now, dataStamp)
  if (kept) return kept
  const page = airfieldPageSql(o)
  const [rows] = await usePool().query(
    `SELECT ${PAGE_VERSIONS_SQL}, pg.total, pg.followed, ${versionOfSql('a.id')} AS v, a.*,
       (SELECT GROUP_CONCAT(e.designator ORDER BY e.designator SEPARATOR ',') FROM runway_ends e WHERE e.airfield_id = a.id) AS designators,
       c.id AS c_id, c.valid_from AS c_valid_from, c.valid_to AS c_valid_to, c.source AS c_source,
       n.id AS n_id, n.valid_from AS n_valid_from, n.valid_to AS n_valid_to, n.source AS n_source
     FROM ${page.sql}
     JOIN airfields a ON a.id = pg.id
     LEFT JOIN profiles c ON c.id = ${CURRENT_ID_SQL}
     LEFT JOIN profiles n ON n.id = ${NEXT_ID_SQL}
     ORDER BY pg.followed DESC, a.code`,
    [o.followerId ?? null, ...page.args, now, now, now],
  ) as [Row[], unknown]
  const total = rows.length ? Number(rows[0]!.total) : o.page > 1 ? await countAirfieldPage(o) : 0
  const answer = { airfields: rows.map(lineOf), total }
  if (rows.length) {
    // The page changes by itself when a profile in force ends or the next one begins.
    const untilMs = Math.min(...rows.map(r => nextChangeMs(now, r.c_valid_to, r.n_valid_from)))
    keptPages.set(key, answer, pageCountersOfRead(rows, r => r.id), untilMs, 1000 + rows.length * 600, rows.map(r => Number(r.id)), dataStamp)
  }
  return answer
}

export type AirfieldListAnswer = { airfields: AirfieldListPage['airfields'], total: number, page: number, pageSize: number, q: string, at: string }

/**
 * GET /api/airfields as JSON text: the same for every reader, so the requests arriving together for the same page
 * (and with the same data counter from their session reads) share one read and one serialisation, made after each
 * of them arrived (server/utils/shared-read.ts). `key` names the text (for its compressed copy).
 */
export function airfieldListJson(o: AirfieldPageOptions, dataStamp: string | null = null): Promise<{ text: string, key: string }> {
  const key = `airfield-list|${o.q}|${o.page}|${o.pageSize}`
  return sharedRead(`${key}|${dataStamp ?? ''}`, async () => {
    const now = new Date()
    const { airfields, total } = await readAirfieldList(o, now, dataStamp)
    const answer: AirfieldListAnswer = { airfields, total, page: o.page, pageSize: o.pageSize, q: o.q, at: `${now.toISOString().slice(0, 19)}Z` }
    return { text: JSON.stringify(answer), key }
  })
}
