/**
 * Keeps the demo alive: files one UTC day's demo profiles (server/seed/demo-airfields.ts) through the same filing
 * path a feed uses (fileProfile: check, analysis, supersession, audit, alert evaluation). Idempotent by a natural
 * key: a profile of the same airfield, validity and source already there (filed, superseded or withdrawn) is left
 * alone, so a restart, a second instance or the next check of the day files nothing twice. Demo only.
 */
import { and, eq } from 'drizzle-orm'
import * as schema from '../db/schema'
import { takeTurn, transaction, type DB } from '../utils/db'
import { fileProfile } from '../domain/profiles/filing'
import { DEMO_AIRFIELDS, demoDayStart } from './demo-airfields'

export const DEMO_FILER_EMAIL = 'dispatch@veerline.example'

/** Outside production, unless the demo seed is switched off (VEERLINE_SEED_DEMO=0), as for the seed itself. */
export const demoDaysEnabled = (env: Record<string, string | undefined> = process.env) =>
  env.NODE_ENV !== 'production' && env.VEERLINE_SEED_DEMO !== '0'

/**
 * The UTC day the demo job files: VEERLINE_DEMO_DATE (YYYY-MM-DD, a fixed clock for tests and demos) or today.
 * Answers null for a malformed setting, which the job then reports.
 */
export function demoDay(env: Record<string, string | undefined> = process.env, now = new Date()): Date | null {
  const fixed = env.VEERLINE_DEMO_DATE?.trim()
  if (!fixed) return demoDayStart(now)
  if (!/^\d{4}-\d{2}-\d{2}$/.test(fixed)) return null
  const day = new Date(`${fixed}T00:00:00Z`)
  return Number.isNaN(day.getTime()) || day.toISOString().slice(0, 10) !== fixed ? null : day
}

export type DemoDayResult = { day: string, filed: number, present: number, refused: { airfield: string, hourZ: number, message: string }[] }

export async function fileDemoDay(db: DB, dayStart: Date): Promise<DemoDayResult> {
  const result: DemoDayResult = { day: dayStart.toISOString().slice(0, 10), filed: 0, present: 0, refused: [] }
  const [filer] = await db.select().from(schema.users).where(eq(schema.users.email, DEMO_FILER_EMAIL))
  if (!filer) {
    result.refused.push({ airfield: '*', hourZ: 0, message: `the demo filer ${DEMO_FILER_EMAIL} does not exist` })
    return result
  }
  for (const a of DEMO_AIRFIELDS) {
    for (const slot of a.slots) {
      const validFrom = new Date(dayStart.getTime() + slot.hourZ * 3600_000)
      const validTo = new Date(validFrom.getTime() + 3 * 3600_000)
      try {
        const filed = await transaction(async (tx) => {
          // A write to this slot's turn row is the lock: a second instance on the same database node waits here,
          // one on another Galera node conflicts at COMMIT and runs again; either then finds the profile and leaves it.
          // (A row lock alone is local to one node.)
          await takeTurn(tx, `demo:${a.code}:${validFrom.toISOString()}:${slot.source}`)
          const [airfield] = await tx.select().from(schema.airfields).where(eq(schema.airfields.code, a.code))
          if (!airfield) throw new Error(`the demo airfield ${a.code} does not exist`)
          const p = schema.profiles
          const [present] = await tx.select({ id: p.id }).from(p).where(and(eq(p.airfieldId, airfield.id), eq(p.validFrom, validFrom),
            eq(p.validTo, validTo), eq(p.source, slot.source))).limit(1)
          if (present) return false
          await fileProfile(tx, {
            airfield,
            actor: { user: filer },
            entryMethod: 'api',
            input: { validFrom: validFrom.toISOString(), validTo: validTo.toISOString(), source: slot.source, heightReference: a.heightReference,
              levels: slot.levels, ...(slot.notes ? { notes: slot.notes } : {}) },
            details: { demo: true, demoDay: result.day },
          })
          return true
        }, { db })
        if (filed) result.filed++
        else result.present++
      }
      catch (err) {
        result.refused.push({ airfield: a.code, hourZ: slot.hourZ, message: (err as Error).message })
      }
    }
  }
  return result
}
