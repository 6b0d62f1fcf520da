/**
 * Reading briefings at the cost of a session check: one query finds the airfield, the profile in force (or asked
 * for), the reader's receipt and a stamp of everything the analysis depends on; the analysed, rounded and
 * serialised briefing of that (profile, stamp) comes from the cache, or is computed once and kept.
 * The home list reads a page of airfields' lines in one query the same way.
 */
import { createHash } from 'node:crypto'
import type { Airfield, Profile, RunwayEnd, ThresholdSet } from '../../db/schema'
import { asc, inArray, or, schema, usePool, useDB } from '../../utils/db'
import { analyseStored } from '../profiles/analysis'
import { assembleBriefing, publicAirfield, rankRunwayEnds, type Briefing } from './briefing'
import { DEFAULT_STALE_AFTER_MIN, profileAges, profileStatusAt, statusWordsAt } from '../../../shared/briefing/status'
import { briefingChangeOf, keyFiguresOf } from '../../../shared/briefing/change'
import { evaluateLimits } from '../../../shared/limits'
import { limitSetFromRows } from '../alerts/limits'
import { VEERLINE_CAUTION } from '../../../shared/utils/caution'
import { BoundedCache } from './analysis-cache'
import { sharedRead } from '../../utils/shared-read'
import { displayGridIndexes, displayLevelIndexes, roundFigures } from './precision'
import { airfieldPageSql, countAirfieldPage, keptPage, PAGE_VERSIONS_SQL, pageCountersOfRead, pageKeyOf, type AirfieldPageOptions } from '../airfields/list-read'
import { KeptAnswers, nextChangeMs, ORG_VERSION_SQL, versionOfSql } from '../airfields/versions'
import type { ReadStamp } from '../accounts/session-store'

/** Changes whenever the engine, the magnetic model or the shape of the answer changes: part of every key. */
const CODE_VERSION = 'engine-1;wmm2025;view-2'

const CAUTION_JSON = JSON.stringify(VEERLINE_CAUTION)

// Everything an analysis and its checks read, folded into one digest per airfield (NULLs spelled out so that a
// value moving between columns still changes it). The profile's own levels never change once filed.
const ENDS_SIG = `GROUP_CONCAT(CONCAT_WS(',', e.id, e.runway_id, e.designator, e.true_heading_deg) ORDER BY e.id SEPARATOR ';')`
const LIMITS_SIG = `GROUP_CONCAT(CONCAT_WS(',', t.id, t.scope_key, t.updated_at, IFNULL(t.max_crosswind_kt, '~'),
  IFNULL(t.max_tailwind_kt, '~'), IFNULL(t.max_layer_shear_kt_per_100ft, '~'), IFNULL(t.max_vector_diff_600m_kt, '~'),
  IFNULL(t.max_airspeed_loss_kt, '~'), IFNULL(t.max_f_factor, '~'), IFNULL(t.near_limit_margin_pct, '~')) ORDER BY t.id SEPARATOR ';')`
const ORG_LIMITS_SQL = `(SELECT ${LIMITS_SIG} FROM threshold_sets t WHERE t.scope_key = 'org')`
/** The digest of one airfield's analysis inputs (row `a`): its row, runway ends and limit sets. */
export const STAMP_ONE_SQL = `MD5(CONCAT_WS('|', a.id, a.code, a.name, a.updated_at,
  a.latitude_deg, a.longitude_deg, a.elevation_m, IFNULL(a.mag_var_override_deg, '~'), IFNULL(a.mag_var_override_reason, '~'),
  IFNULL(a.path_settings, '~'), IFNULL((SELECT ${ENDS_SIG} FROM runway_ends e WHERE e.airfield_id = a.id), '~'), IFNULL(${ORG_LIMITS_SQL}, '~'),
  IFNULL((SELECT ${LIMITS_SIG} FROM threshold_sets t WHERE t.airfield_id = a.id), '~')))`

// Supersession by time: the newer profile that took over the moment given (twice, as two placeholders), or NULL.
const SUPERSEDED_NOW_SQL = `(SELECT s.superseded_by_id FROM profile_supersessions s WHERE s.profile_id = p.id
    AND s.from_at <= ? AND s.to_at > ? ORDER BY s.superseded_by_id DESC LIMIT 1)`
// The columns of the profile read with a briefing; their placeholders come first: the chosen time twice, then now twice.
const PROFILE_COLUMNS = `p.id AS p_id, p.valid_from AS p_valid_from, p.valid_to AS p_valid_to, p.source AS p_source,
  p.height_reference AS p_height_reference, p.status AS p_status, p.superseded_by_id AS p_superseded_by_id,
  p.withdrawn_reason AS p_withdrawn_reason, p.notes AS p_notes, p.created_at AS p_created_at,
  p.qnh_hpa AS p_qnh_hpa, p.surface_pressure_hpa AS p_surface_pressure_hpa, p.raw_report AS p_raw_report, p.observed_at AS p_observed_at,
  p.reported_wind_shear AS p_reported_wind_shear, ${SUPERSEDED_NOW_SQL} AS p_superseded_then_by,
  ${SUPERSEDED_NOW_SQL} AS p_superseded_now_by`

// The profile a briefing is for: the newest active one valid at `at`, else the newest not withdrawn begun by `at`.
const LATEST_BEGUN_SQL = `(SELECT q.id FROM profiles q WHERE q.airfield_id = a.id AND q.status <> 'withdrawn' AND q.valid_from <= ?
    ORDER BY q.valid_from DESC, q.id DESC LIMIT 1)`
const IN_FORCE_SQL = `COALESCE(
  (SELECT q.id FROM profiles q WHERE q.airfield_id = a.id AND q.status = 'active' AND q.valid_from <= ? AND q.valid_to >= ?
    ORDER BY q.id DESC LIMIT 1), ${LATEST_BEGUN_SQL})`
// A raw mysql2 row: its columns are typed where they are read.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Row = Record<string, any>

function profileOf(r: Row, airfieldId: number) {
  return {
    id: r.p_id, airfieldId, validFrom: r.p_valid_from, validTo: r.p_valid_to, source: r.p_source,
    heightReference: r.p_height_reference, status: r.p_status, supersededById: r.p_superseded_by_id,
    withdrawnReason: r.p_withdrawn_reason, notes: r.p_notes, createdAt: r.p_created_at,
    qnhHpa: r.p_qnh_hpa, surfacePressureHpa: r.p_surface_pressure_hpa, rawReport: r.p_raw_report, observedAt: r.p_observed_at ?? null,
    // MariaDB keeps JSON as text: read it back as drizzle would.
    reportedWindShear: typeof r.p_reported_wind_shear === 'string' ? JSON.parse(r.p_reported_wind_shear) : (r.p_reported_wind_shear ?? null),
    supersededThenById: (r.p_superseded_then_by as number | null) ?? null,
    supersededNowById: (r.p_superseded_now_by as number | null) ?? null,
  } as Pick<Profile, 'id' | 'airfieldId' | 'validFrom' | 'validTo' | 'source' | 'heightReference' | 'status'
  | 'supersededById' | 'withdrawnReason' | 'notes' | 'createdAt' | 'qnhHpa' | 'surfacePressureHpa' | 'rawReport' | 'observedAt' | 'reportedWindShear'>
  & { supersededThenById: number | null, supersededNowById: number | null }
}

type ProfileHead = ReturnType<typeof profileOf>

export type CachedBriefing = {
  /** The briefing without its per-request fields (at, generatedAt, profile), serialised, `{` … `}`. */
  restJson: string
  exceededCount: number
  bestEnd: string | null
  bytes: number
}

export const briefingCache = new BoundedCache<CachedBriefing>()

export type Precision = 'trade' | 'full'

const keyOf = (profileId: number, stamp: string, precision: Precision, focus: EndFocus = 'all') => `${profileId}|${stamp}|${precision}|${focus}|${CODE_VERSION}`

/** The figures a page shows: levels thinned for display, no figure twice, rounded to the trade's precision. */
/**
 * Which runway ends a briefing answer details: every one ('all', the API's default), or the one a page shows (a
 * designator; an unknown one, or 'best', gives the best-ranked end, as the page chooses when nothing else is asked).
 */
export type EndFocus = string

/** The answer with its per-end figures (components by height and level, checks, paths) for the focused ends only. */
type Focusable = {
  runwayEnds: { designator: string }[]
  ranking: { designator: string }[]
  feetSteps: { components: { designator: string }[] }[]
  keyHeights: Record<'ft' | 'm', { components: { designator: string }[] }[]>
}
export function focusEnds<T extends Focusable>(b: T, focus: EndFocus): T {
  if (focus === 'all') return b
  const known = b.runwayEnds.some(e => e.designator === focus)
  const chosen = known ? focus : (b.ranking[0]?.designator ?? b.runwayEnds[0]?.designator)
  const only = <C extends { designator: string }>(xs: C[]) => xs.filter(x => x.designator === chosen)
  return {
    ...b,
    runwayEnds: only(b.runwayEnds),
    feetSteps: b.feetSteps.map(f => ({ ...f, components: only(f.components) })),
    keyHeights: { ft: b.keyHeights.ft.map(k => ({ ...k, components: only(k.components) })), m: b.keyHeights.m.map(k => ({ ...k, components: only(k.components) })) },
  }
}

export function briefingView(full: Briefing, profileId: number) {
  const keep = displayLevelIndexes(full.levels.map(l => l.heightAglM))
  const pick = <T>(xs: T[]) => (keep.length === xs.length ? xs : keep.map(i => xs[i]!))
  const shownSources = new Set(keep.map(i => full.levels[i]!.sourceIndex))
  const keepGrid = displayGridIndexes(full.grid, shownSources)
  const pickGrid = <T>(xs: T[]) => (keepGrid.length === xs.length ? xs : keepGrid.map(i => xs[i]!))
  const { checks: _all, input, levels, grid, runwayEnds, ...rest } = full
  return roundFigures({
    ...rest,
    input: { heightReference: input.heightReference, elevationM: input.elevationM, runwayEnds: input.runwayEnds,
      levelCount: input.levels.length, levelsUrl: `/api/profiles/${profileId}` },
    display: {
      levelsShown: keep.length,
      levelCount: levels.length,
      note: keep.length === levels.length
        ? null
        : `${keep.length} of ${levels.length} levels shown (evenly spread, most of them in the lowest 600 m); every level is in the filed profile`,
    },
    levels: pick(levels),
    grid: pickGrid(grid),
    runwayEnds: runwayEnds.map(({ exceeded: _e, near: _n, ...end }) => ({ ...end, levels: pick(end.levels), byHeight: pickGrid(end.byHeight) })),
  })
}

/** Analyses stored profiles of several airfields in a fixed number of queries and keeps each in the cache. */
async function computeMany(items: { key: string, precision: Precision, focus?: EndFocus, profile: ProfileHead, airfield: Airfield }[]) {
  if (!items.length) return new Map<string, CachedBriefing>()
  const db = useDB()
  const airfieldIds = [...new Set(items.map(i => i.airfield.id))]
  const profileIds = [...new Set(items.map(i => i.profile.id))]
  // The profiles these ones superseded: the briefing shows what changed against the newest of them.
  // Supersession by time keeps a record per profile taken over (in part or whole); older rows only have supersededById.
  const s = schema.profileSupersessions
  const records = await db.select({ profileId: s.profileId, byId: s.supersededById }).from(s).where(inArray(s.supersededById, profileIds))
  const previousIds = new Map<number, Set<number>>()
  for (const r of records) previousIds.set(r.profileId, (previousIds.get(r.profileId) ?? new Set()).add(r.byId))
  const previousRows = await db.select().from(schema.profiles).where(or(inArray(schema.profiles.supersededById, profileIds),
    inArray(schema.profiles.id, [0, ...previousIds.keys()])))
  const [endRows, levelRows, limitRows] = await Promise.all([
    db.select().from(schema.runwayEnds).where(inArray(schema.runwayEnds.airfieldId, airfieldIds)),
    db.select().from(schema.profileLevels).where(inArray(schema.profileLevels.profileId, [...profileIds, ...previousRows.map(p => p.id)]))
      .orderBy(asc(schema.profileLevels.profileId), asc(schema.profileLevels.seq)),
    usePool().query(`SELECT * FROM threshold_sets WHERE scope_key = 'org' OR airfield_id IN (?)`, [airfieldIds])
      .then(([rows]) => (rows as Row[]).map(thresholdRow)),
  ])
  const out = new Map<string, CachedBriefing>()
  for (const item of items) {
    const ends = endRows.filter(e => e.airfieldId === item.airfield.id)
    const levels = levelRows.filter(l => l.profileId === item.profile.id)
    const limitSet = limitSetFromRows(limitRows, item.airfield.id)
    // The analysis reads the stored columns only; whether it is superseded then belongs to the per-request head.
    const { supersededThenById: _then, supersededNowById: _now, ...columns } = item.profile
    const stored = analyseStored(columns as Profile, item.airfield, ends, levels)
    const checks = evaluateLimits(stored.analysis, limitSet.limits, limitSet.limitsFor, stored.profile.reportedWindShear ?? null)
    const previous = previousRows.filter(p => p.supersededById === item.profile.id || previousIds.get(p.id)?.has(item.profile.id))
      .sort((a, b) => b.validFrom.getTime() - a.validFrom.getTime() || b.id - a.id)[0]
    let change = null
    if (previous) {
      // The superseded profile held against today's limits and runway ends: the change is the wind's, not the limits'.
      const before = analyseStored(previous, item.airfield, ends, levelRows.filter(l => l.profileId === previous.id))
      const beforeChecks = evaluateLimits(before.analysis, limitSet.limits, limitSet.limitsFor, previous.reportedWindShear ?? null)
      change = briefingChangeOf(previous.id, keyFiguresOf(before.analysis, beforeChecks), keyFiguresOf(stored.analysis, checks))
    }
    const full = assembleBriefing(stored, limitSet, change)
    const ranking = rankRunwayEnds(stored.analysis.runwayEnds, checks)
    const rest = focusEnds(item.precision === 'full' ? full : briefingView(full, item.profile.id), item.focus ?? 'all')
    const restJson = JSON.stringify(rest)
    const entry: CachedBriefing = {
      restJson,
      exceededCount: checks.filter(c => c.state === 'exceeded').length,
      bestEnd: ranking[0]?.withinLimits ? ranking[0].designator : null,
      bytes: restJson.length + 200,
    }
    briefingCache.set(item.key, entry)
    out.set(item.key, entry)
  }
  return out
}

function thresholdRow(r: Row): ThresholdSet {
  return {
    id: r.id, scopeKey: r.scope_key, airfieldId: r.airfield_id, designator: r.designator,
    maxCrosswindKt: r.max_crosswind_kt, maxTailwindKt: r.max_tailwind_kt, maxLayerShearKtPer100ft: r.max_layer_shear_kt_per_100ft,
    maxVectorDiff600mKt: r.max_vector_diff_600m_kt, maxAirspeedLossKt: r.max_airspeed_loss_kt, maxFFactor: r.max_f_factor,
    nearLimitMarginPct: r.near_limit_margin_pct, updatedByUserId: r.updated_by_user_id, updatedAt: r.updated_at,
  }
}

function airfieldOf(r: Row): Airfield {
  return {
    id: r.a_id, code: r.a_code, name: r.a_name, latitudeDeg: r.a_latitude_deg, longitudeDeg: r.a_longitude_deg,
    elevationM: r.a_elevation_m, elevationUnit: r.a_elevation_unit, magVarOverrideDeg: r.a_mag_var_override_deg,
    magVarOverrideReason: r.a_mag_var_override_reason, notes: r.a_notes, createdAt: r.a_created_at, updatedAt: r.a_updated_at,
    reportingStation: r.a_reporting_station,
    pathSettings: typeof r.a_path_settings === 'string' ? JSON.parse(r.a_path_settings) : (r.a_path_settings ?? null),
  }
}

const AIRFIELD_COLUMNS = `a.id AS a_id, a.code AS a_code, a.name AS a_name, a.latitude_deg AS a_latitude_deg,
  a.longitude_deg AS a_longitude_deg, a.elevation_m AS a_elevation_m, a.elevation_unit AS a_elevation_unit,
  a.mag_var_override_deg AS a_mag_var_override_deg, a.mag_var_override_reason AS a_mag_var_override_reason,
  a.notes AS a_notes, a.created_at AS a_created_at, a.updated_at AS a_updated_at,
  a.reporting_station AS a_reporting_station, a.path_settings AS a_path_settings`

/** Minutes after filing past which the briefing warns that its profile is stale (VEERLINE_STALE_AFTER_MIN). */
export const STALE_AFTER_MIN = Number(process.env.VEERLINE_STALE_AFTER_MIN) || DEFAULT_STALE_AFTER_MIN

/** The profile's head for one read: its status at the chosen time (`at`, now by default) and its ages. */
export function publicProfileOf(p: ProfileHead, now: Date, at: Date = now, chosen = false) {
  const status = profileStatusAt(p, at, p.supersededThenById != null)
  return {
    id: p.id,
    source: p.source,
    validFrom: p.validFrom.toISOString(),
    validTo: p.validTo.toISOString(),
    filedAt: p.createdAt.toISOString(),
    heightReference: p.heightReference,
    // A coded report's observation time dates the data; otherwise the filing does.
    ...profileAges({ createdAt: p.createdAt, observedAt: p.observedAt }, now, at, STALE_AFTER_MIN),
    /** At the chosen time; `statusNow` is where it stands now. */
    status,
    statusWords: statusWordsAt(status, p, at, chosen),
    statusNow: profileStatusAt(p, now, p.supersededNowById != null),
    supersededById: (status === 'superseded' ? p.supersededThenById : p.supersededNowById) ?? p.supersededById,
    withdrawnReason: p.withdrawnReason,
    notes: p.notes,
    qnhHpa: p.qnhHpa ?? null,
    surfacePressureHpa: p.surfacePressureHpa ?? null,
    rawReport: p.rawReport ?? null,
    reportedWindShear: p.reportedWindShear ?? null,
  }
}

export type BriefingView = ReturnType<typeof briefingView>

/** The shape of the JSON text readBriefing answers (for the route's type: the text itself is spliced, not built). */
type BriefingBody = BriefingView & { at: string, atChosen: boolean, generatedAt: string, profile: ReturnType<typeof publicProfileOf> }
type ReceiptBody = { id: number, profileId: number, readAt: string }
export type BriefingAnswer
  = | { briefing: BriefingBody, receipt: ReceiptBody | null, caution: string }
    | { briefing: null, airfield: ReturnType<typeof publicAirfield>, at: string, message: string, caution: string, receipt: null }

export type BriefingRead
  = | { kind: 'no-airfield', code: string }
    | { kind: 'no-such-profile', code: string, profileId: number }
    | { kind: 'no-profile', body: string, etag: string, memoKey: string }
    | { kind: 'briefing', body: string, etag: string, profileId: number, memoKey: string }

/** An instant as ISO 8601 to the whole second (2026-12-02T15:04:05Z). */
export const toSecond = (d: Date) => `${d.toISOString().slice(0, 19)}Z`

const weakTag = (s: string) => `W/"${createHash('md5').update(s).digest('base64url')}"`

// When the profile a briefing is read from changes by itself: the next profile (not withdrawn) to begin after now, and
// the next start or end of a supersession of this profile (placeholders: now; now, now).
const NEXT_FROM_SQL = `(SELECT MIN(q.valid_from) FROM profiles q WHERE q.airfield_id = a.id AND q.status <> 'withdrawn' AND q.valid_from > ?)`
const SUPERSESSION_CHANGE_SQL = `(SELECT MIN(IF(s.from_at > ?, s.from_at, s.to_at)) FROM profile_supersessions s WHERE s.profile_id = p.id AND s.to_at > ?)`
/** The moment a row read with NEXT_FROM_SQL and SUPERSESSION_CHANGE_SQL may read differently with nothing written. */
const rowChangeMs = (r: Row, now: Date) => nextChangeMs(now, r.p_valid_to, r.next_from, r.supersession_change)

// The row a briefing is made from (airfield, profile, stamp), kept per airfield, version asked and time asked while
// the airfield's counters stand, for every reader; each reader's receipt of a profile is kept beside it while their
// receipt counter stands.
const keptBriefingRows = new KeptAnswers<Row>(4000)
type Receipt = { r_id: number | null, r_read_at: Date | null }
const keptReceipts = new KeptAnswers<Receipt>(20000, 4 * 1024 * 1024)
/** A reader's receipt as just read: it stands while their receipt counter stays at the stamp's (no time limit). */
const keepReceipt = (key: string, receipt: Receipt, stamp: ReadStamp | null) =>
  keptReceipts.set(key, receipt, '', Number.POSITIVE_INFINITY, 100, [], stamp?.reader ?? null)

/**
 * The row of a briefing with the reader's receipt: kept and confirmed at this request's read stamp (no query), kept
 * and its counters still standing (one query of primary-key reads, with the receipt), or read in full.
 */
async function briefingRow(upper: string, userId: number, opts: BriefingOptions, now: Date, at: Date): Promise<Row | undefined> {
  const key = `${upper}|${opts.profileId ?? ''}|${opts.at?.toISOString() ?? 'now'}`
  const stamp = opts.stamp ?? null
  if (keptBriefingRows.has(key)) {
    const profileId = keptBriefingRows.peekValue(key)?.p_id ?? null
    const receiptKey = `${userId}|${profileId}`
    const row = keptBriefingRows.confirmed(key, stamp?.data ?? null, now)
    const receipt = row && keptReceipts.confirmed(receiptKey, stamp?.reader ?? null, now)
    if (row && receipt) return { ...row, ...receipt }
    // A prepared statement (the same text every time): the database parses and plans it once per connection.
    const [checks] = await usePool().execute(
      `SELECT ${versionOfSql('a.id')} AS v, ${ORG_VERSION_SQL} AS org, r.id AS r_id, r.read_at AS r_read_at
       FROM airfields a LEFT JOIN briefing_receipts r ON r.user_id = ? AND r.profile_id = ? WHERE a.code = ?`,
      [userId, profileId, upper],
    ) as [Row[], unknown]
    const check = checks[0]
    const kept = check ? keptBriefingRows.get(key, `${check.v}|${check.org}`, now) : undefined
    if (kept) {
      const found: Receipt = { r_id: check!.r_id ?? null, r_read_at: check!.r_read_at ?? null }
      keptBriefingRows.confirm(key, stamp?.data ?? null)
      keepReceipt(receiptKey, found, stamp)
      return { ...kept, ...found }
    }
  }
  const profileExpr = opts.profileId != null ? `(SELECT q.id FROM profiles q WHERE q.id = ? AND q.airfield_id = a.id)` : IN_FORCE_SQL
  const profileArgs = opts.profileId != null ? [opts.profileId] : [at, at, at]
  const [rows] = await usePool().query(
    `SELECT ${versionOfSql('a.id')} AS v, ${ORG_VERSION_SQL} AS org, ${AIRFIELD_COLUMNS}, ${PROFILE_COLUMNS},
       ${NEXT_FROM_SQL} AS next_from, ${SUPERSESSION_CHANGE_SQL} AS supersession_change,
       r.id AS r_id, r.read_at AS r_read_at, ${STAMP_ONE_SQL} AS stamp
     FROM airfields a
     LEFT JOIN profiles p ON p.id = ${profileExpr}
     LEFT JOIN briefing_receipts r ON r.user_id = ? AND r.profile_id = p.id
     WHERE a.code = ?`,
    [at, at, now, now, now, now, now, ...profileArgs, userId, upper],
  ) as [Row[], unknown]
  const row = rows[0]
  if (row) {
    keptBriefingRows.set(key, row, `${row.v}|${row.org}`, rowChangeMs(row, now), 3000, [], stamp?.data ?? null)
    keepReceipt(`${userId}|${row.p_id ?? null}`, { r_id: row.r_id ?? null, r_read_at: row.r_read_at ?? null }, stamp)
  }
  return row
}

/**
 * What a briefing is asked for: `at` defaults to now; `profileId` picks a version of this airfield; `stamp` is the
 * reader's read stamp (server/utils/auth.ts readStampOf), null when there is none.
 */
export type BriefingOptions = { at?: Date, profileId?: number, precision?: Precision, end?: EndFocus, stamp?: ReadStamp | null }

/** The briefing answer of GET /api/airfields/{code}/briefing as JSON text with its ETag, for one reader. */
export function readBriefing(code: string, userId: number, opts: BriefingOptions): Promise<BriefingRead> {
  // The same reader asking the same briefing at the same moment shares one read (server/utils/shared-read.ts), made
  // after each of them arrived: never staler than a read of its own. The read stamp is part of the key: a request
  // is only ever answered by what its own session read vouches for.
  const key = `briefing:${code.toUpperCase()}|${userId}|${opts.profileId ?? ''}|${opts.at?.toISOString() ?? 'now'}|${opts.precision ?? 'trade'}|${opts.end ?? 'all'}`
  const stamp = opts.stamp ? `${opts.stamp.data}:${opts.stamp.reader}` : ''
  return sharedRead(`${key}|${stamp}`, () => readBriefingNow(code, userId, opts, key))
}

async function readBriefingNow(code: string, userId: number, opts: BriefingOptions, memoKey: string): Promise<BriefingRead> {
  const now = new Date()
  const at = opts.at ?? now
  const precision = opts.precision ?? 'trade'
  const upper = code.toUpperCase()
  const row = await briefingRow(upper, userId, opts, now, at)
  if (!row) return { kind: 'no-airfield', code: upper }
  const airfield = airfieldOf(row)
  if (row.p_id == null) {
    if (opts.profileId != null) return { kind: 'no-such-profile', code: airfield.code, profileId: opts.profileId }
    // Small and rare: built each time (the runway ends are read only here).
    const ends = await useDB().select().from(schema.runwayEnds).where(inArray(schema.runwayEnds.airfieldId, [airfield.id])) as RunwayEnd[]
    const body = JSON.stringify({ briefing: null, airfield: roundFigures(publicAirfield(airfield, ends)), at: at.toISOString(),
      message: `No wind profile has been filed for ${airfield.code} at or before ${at.toISOString()}`, caution: VEERLINE_CAUTION, receipt: null })
    return { kind: 'no-profile', body, etag: weakTag(`${row.stamp}|none|${opts.at ? at.toISOString() : ''}`), memoKey }
  }
  const profile = profileOf(row, airfield.id)
  const focus = opts.end ?? 'all'
  const key = keyOf(profile.id, row.stamp, precision, focus)
  const entry = briefingCache.get(key) ?? (await computeMany([{ key, precision, focus, profile, airfield }])).get(key)!
  const p = publicProfileOf(profile, now, at, opts.at != null)
  // Times to the second (a chosen time as given): within one second, nothing changed, the same text (and its gzip).
  const head = JSON.stringify({ at: opts.at ? at.toISOString() : toSecond(now), atChosen: opts.at != null, generatedAt: toSecond(now), profile: p })
  const receipt = row.r_id == null ? null : { id: row.r_id, profileId: profile.id, readAt: (row.r_read_at as Date).toISOString() }
  const receiptJson = JSON.stringify(receipt)
  // The same kept analysis, head and receipt as the last read of this key: the very same text and tag (so the
  // compressed copy is found by identity, server/utils/json-text.ts).
  const last = briefingTexts.peek(memoKey)
  if (last && last.restJson === entry.restJson && last.head === head && last.receiptJson === receiptJson) {
    return { kind: 'briefing', body: last.body, etag: last.etag, profileId: profile.id, memoKey }
  }
  const body = `{"briefing":${head.slice(0, -1)},${entry.restJson.slice(1)},"caution":${CAUTION_JSON},"receipt":${receiptJson}}`
  // Same profile version, same inputs, same status and receipt: the same briefing (the times in it aside).
  const etag = weakTag(`${key}|${p.status}|${p.statusNow}|${p.supersededById}|${p.withdrawnReason}|${p.filedMinutesAgo}|${p.stale}|${receiptJson}|${opts.at ? at.toISOString() : ''}`)
  briefingTexts.set(memoKey, { restJson: entry.restJson, head, receiptJson, body, etag, bytes: body.length })
  return { kind: 'briefing', body, etag, profileId: profile.id, memoKey }
}

// The last text made for each briefing key (reader, airfield, version, time, precision, end), bounded in number and
// bytes (the texts are mostly the ones the compressed memo holds too).
const briefingTexts = new BoundedCache<{ restJson: string, head: string, receiptJson: string, body: string, etag: string, bytes: number }>(500, 32 * 1024 * 1024)

type SummaryRow = { airfield: Airfield, profile: ProfileHead | null, key: string, runwayEnds: string[], followed: boolean }
const keptSummaries = new KeptAnswers<{ rows: SummaryRow[], total: number }>(2000)

/** The rows of one page of the home list: kept while the page's counters stand and nothing time-bound ran out. */
async function readSummaryRows(o: AirfieldPageOptions, now: Date, dataStamp: string | null) {
  const key = pageKeyOf(o)
  const kept = await keptPage(keptSummaries, key, o, now, dataStamp)
  if (kept) return kept
  const page = airfieldPageSql(o)
  const [rows] = await usePool().query(
    `SELECT ${PAGE_VERSIONS_SQL}, pg.total, pg.followed, ${versionOfSql('a.id')} AS v,
       ${AIRFIELD_COLUMNS}, ${PROFILE_COLUMNS}, ${STAMP_ONE_SQL} AS stamp,
       (SELECT GROUP_CONCAT(e.designator ORDER BY e.designator SEPARATOR ',') FROM runway_ends e WHERE e.airfield_id = a.id) AS designators,
       ${NEXT_FROM_SQL} AS next_from, ${SUPERSESSION_CHANGE_SQL} AS supersession_change
     FROM ${page.sql}
     JOIN airfields a ON a.id = pg.id
     LEFT JOIN profiles p ON p.id = ${IN_FORCE_SQL}
     ORDER BY pg.followed DESC, a.code`,
    [o.followerId ?? null, now, now, now, now, now, now, now, ...page.args, now, now, now],
  ) as [Row[], unknown]
  const summaryRows: SummaryRow[] = rows.map((r) => {
    const airfield = airfieldOf(r)
    const profile = r.p_id == null ? null : profileOf(r, airfield.id)
    return { airfield, profile, key: profile ? keyOf(profile.id, r.stamp, 'trade') : '', runwayEnds: r.designators ? String(r.designators).split(',') : [], followed: Number(r.followed) === 1 }
  })
  const total = rows.length ? Number(rows[0]!.total) : o.page > 1 ? await countAirfieldPage(o) : 0
  const answer = { rows: summaryRows, total }
  if (rows.length) {
    const untilMs = Math.min(...rows.map(r => rowChangeMs(r, now)))
    keptSummaries.set(key, answer, pageCountersOfRead(rows, r => r.a_id), untilMs, 2000 + rows.length * 1500, rows.map(r => Number(r.a_id)), dataStamp)
  }
  return answer
}

/**
 * One line per airfield of a page of the home list (the reader's followed airfields first, then by code): its
 * profile in force now and what it crosses. One query for the page, whatever the number of airfields (only the
 * counters while nothing changed); analyses not yet kept are computed in a fixed number more.
 */
export async function readBriefingSummaries(o: AirfieldPageOptions, now = new Date()) {
  return summariesOf(await readSummaryRows(o, now, null), now)
}

async function summariesOf({ rows, total }: { rows: SummaryRow[], total: number }, now: Date) {
  const items = rows.map(row => ({ ...row, entry: row.profile ? briefingCache.get(row.key) : undefined }))
  const missing = items.filter(i => i.profile && !i.entry)
  const computed = await computeMany(missing.map(i => ({ key: i.key, precision: 'trade' as const, profile: i.profile!, airfield: i.airfield })))
  const airfields = items.map(({ airfield, profile, key, entry, runwayEnds, followed }) => {
    if (!profile) return { code: airfield.code, name: airfield.name, followed, runwayEnds, profile: null, exceededCount: 0, bestEnd: null }
    const e = entry ?? computed.get(key)!
    return { code: airfield.code, name: airfield.name, followed, runwayEnds, profile: publicProfileOf(profile, now), exceededCount: e.exceededCount, bestEnd: e.bestEnd }
  })
  return { airfields, total }
}

export type BriefingListAnswer = {
  airfields: Awaited<ReturnType<typeof readBriefingSummaries>>['airfields']
  total: number
  page: number
  pageSize: number
  q: string
  followedOnly: boolean
  caution: string
}

/**
 * GET /api/briefings as JSON text for one reader (their followed airfields come first): one read and serialisation
 * for the requests of that reader and page arriving together.
 */
// The text of a page of the home list made from the same kept rows within the same second is the same text (ages
// are whole minutes, as in the briefing's head): made once. Bounded like the other memos.
const listTexts = new Map<string, { rows: SummaryRow[], second: number, text: string }>()
const LIST_TEXTS_MAX = 500

export function briefingListJson(o: AirfieldPageOptions & { followerId: number }, dataStamp: string | null = null): Promise<{ text: string, key: string }> {
  const key = `briefing-list|${pageKeyOf(o)}`
  return sharedRead(`${key}|${dataStamp ?? ''}`, async () => {
    const now = new Date()
    const second = Math.floor(now.getTime() / 1000)
    const kept = await readSummaryRows(o, now, dataStamp)
    const memo = listTexts.get(key)
    if (memo && memo.rows === kept.rows && memo.second === second) return { text: memo.text, key }
    const { airfields, total } = await summariesOf(kept, now)
    const answer: BriefingListAnswer = { airfields, total, page: o.page, pageSize: o.pageSize, q: o.q, followedOnly: !!o.onlyFollowed, caution: VEERLINE_CAUTION }
    const text = JSON.stringify(answer)
    listTexts.delete(key)
    listTexts.set(key, { rows: kept.rows, second, text })
    while (listTexts.size > LIST_TEXTS_MAX) listTexts.delete(listTexts.keys().next().value as string)
    return { text, key }
  })
}
