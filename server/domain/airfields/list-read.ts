/**
 * The airfield list in one query: every airfield with its runway end designators and the profile in force now
 * and the next one (grouped in derived tables, the profiles through their (status, valid to) index), instead
 * of two queries per airfield.
 */
import type { Airfield } from '../../db/schema'
import { usePool } from '../../utils/db'
import { sharedRead } from '../../utils/shared-read'
import { airfieldSummary } from './index'

// A raw mysql2 row: its columns are typed where they are read.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Row = Record<string, any>

const brief = (id: number | null, validFrom: Date | null, validTo: Date | null, source: string | null) =>
  id == null ? null : { id, validFrom: validFrom!.toISOString(), validTo: validTo!.toISOString(), source: source! }

// One active profile per airfield among those still valid at `now` (through the (status, valid_to) index), the
// first in `order`: in force now is the newest filed (supersession by time), next is the earliest to begin.
const firstValid = (also: string, order: string) => `(SELECT w.* FROM (SELECT q.id, q.airfield_id, q.valid_from, q.valid_to, q.source,
    ROW_NUMBER() OVER (PARTITION BY q.airfield_id ORDER BY ${order}) AS rn
    FROM profiles q WHERE q.status = 'active' AND q.valid_to > ? AND ${also}) w WHERE w.rn = 1)`

export async function readAirfieldList(now = new Date()) {
  const [rows] = await usePool().query(
    `SELECT a.*, es.designators,
       c.id AS c_id, c.valid_from AS c_valid_from, c.valid_to AS c_valid_to, c.source AS c_source,
       n.id AS n_id, n.valid_from AS n_valid_from, n.valid_to AS n_valid_to, n.source AS n_source
     FROM airfields a
     LEFT JOIN (SELECT e.airfield_id, GROUP_CONCAT(e.designator ORDER BY e.designator SEPARATOR ',') AS designators
       FROM runway_ends e GROUP BY e.airfield_id) es ON es.airfield_id = a.id
     LEFT JOIN ${firstValid('q.valid_from <= ?', 'q.id DESC')} c ON c.airfield_id = a.id
     LEFT JOIN ${firstValid('q.valid_from > ?', 'q.valid_from ASC, q.id ASC')} n ON n.airfield_id = a.id
     ORDER BY a.code`,
    [now, now, now, now],
  ) as [Row[], unknown]
  return rows.map((r) => {
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
  })
}

export type AirfieldListAnswer = { airfields: Awaited<ReturnType<typeof readAirfieldList>>, at: string }

/**
 * GET /api/airfields as JSON text: the same for every reader, so the requests arriving together share one read
 * and one serialisation, made after each of them arrived (server/utils/shared-read.ts).
 */
export function airfieldListJson(): Promise<{ text: string }> {
  return sharedRead('airfield-list', async () => {
    const now = new Date()
    const answer: AirfieldListAnswer = { airfields: await readAirfieldList(now), at: `${now.toISOString().slice(0, 19)}Z` }
    return { text: JSON.stringify(answer) }
  })
}
