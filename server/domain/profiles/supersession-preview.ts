import type { Airfield } from '../../db/schema'
import { and, eq, gt, inArray, lt, schema, useDB } from '../../utils/db'
import { planSupersession, type Interval } from './supersession'

export type SupersedePreview = {
  /** The active profile the new one would take over, for the time they share ([from, to)). */
  id: number
  validFrom: string
  validTo: string
  from: string
  to: string
  /** Nothing of it would be left in force from now on: it would become 'superseded'. */
  whole: boolean
}

/**
 * What filing a profile valid over [validFrom, validTo) would supersede now, saving nothing: the same plan
 * fileProfile makes (supersession by time), read without locks. The filing itself decides again in its transaction.
 */
export async function supersessionPreview(airfield: Airfield, validFrom: Date, validTo: Date, now = new Date()): Promise<SupersedePreview[]> {
  const p = schema.profiles
  const s = schema.profileSupersessions
  const overlapping = await useDB().select({ id: p.id, validFrom: p.validFrom, validTo: p.validTo }).from(p).where(and(
    eq(p.airfieldId, airfield.id), eq(p.status, 'active'), lt(p.validFrom, validTo), gt(p.validTo, validFrom),
  ))
  const earlier = overlapping.length ? await useDB().select().from(s).where(inArray(s.profileId, overlapping.map(o => o.id))) : []
  const plan = planSupersession(validFrom, validTo, overlapping.map(o => ({
    ...o, superseded: earlier.filter(e => e.profileId === o.id).map((e): Interval => ({ from: e.fromAt, to: e.toAt })),
  })), now)
  return plan.records.map((r) => {
    const o = overlapping.find(x => x.id === r.profileId)!
    return {
      id: r.profileId, validFrom: o.validFrom.toISOString(), validTo: o.validTo.toISOString(),
      from: r.fromAt.toISOString(), to: r.toAt.toISOString(), whole: plan.fullySuperseded.includes(r.profileId),
    }
  }).sort((a, b) => a.id - b.id)
}
