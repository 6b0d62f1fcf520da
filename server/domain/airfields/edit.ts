import type { z } from 'zod'
import type { airfieldCreateSchema, airfieldUpdateSchema, RunwayInput } from '../../../shared/utils/airfield-schema'
import { M_PER_FT } from '../../../shared/units'
import { thresholdDistanceM } from '../../../shared/wind'
import type { Airfield, User } from '../../db/schema'
import { and, asc, eq, schema, transaction } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { conflict, invalid, notFound } from '../../utils/errors'
import { isDuplicateKeyError } from '../../utils/idempotency'
import { airfieldDetail, runwayEndValues } from './index'
import { findAirfield } from './lookup'

/** The runway's length as given, else worked out from its two thresholds when both have coordinates, else none. */
function lengthOf(input: RunwayInput): number | null {
  if (input.lengthM != null) return input.lengthM
  const [a, b] = input.ends
  if (a?.thresholdLatDeg == null || a.thresholdLonDeg == null || b?.thresholdLatDeg == null || b.thresholdLonDeg == null) return null
  const m = thresholdDistanceM(a.thresholdLatDeg, a.thresholdLonDeg, b.thresholdLatDeg, b.thresholdLonDeg)
  return Number.isFinite(m) && m > 0 ? m : null
}

const elevationMOf = (elevation: number, unit: 'm' | 'ft' | undefined) => unit === 'ft' ? elevation * M_PER_FT : elevation

/** Adds an airfield; its code must be new (409 naming the field otherwise). */
export async function createAirfield(user: User, input: z.infer<typeof airfieldCreateSchema>) {
  const { elevation, ...rest } = input
  const values = {
    ...rest,
    elevationM: elevationMOf(elevation, rest.elevationUnit),
    magVarOverrideDeg: rest.magVarOverrideDeg ?? null,
    magVarOverrideReason: rest.magVarOverrideDeg == null ? null : (rest.magVarOverrideReason ?? null),
    notes: rest.notes ?? null,
  }
  const duplicate = () => conflict(`An airfield with the code ${values.code} already exists`, [{ field: 'code', message: 'already in use' }])
  if (await findAirfield(values.code)) throw duplicate()
  return transaction(async (tx) => {
    const [row] = await tx.insert(schema.airfields).values(values).$returningId()
    await recordAudit(tx, { user }, 'airfield.create', 'airfield', row!.id, { code: values.code, name: values.name })
    const [a] = await tx.select().from(schema.airfields).where(eq(schema.airfields.id, row!.id))
    return airfieldDetail(a!, tx)
  }).catch((err) => {
    if (isDuplicateKeyError(err)) throw duplicate()
    throw err
  })
}

/** Changes an airfield's details; the audit entry keeps each changed field before and after. */
export async function updateAirfield(user: User, code: string, input: z.infer<typeof airfieldUpdateSchema>) {
  const { elevation, ...rest } = input
  const change: Record<string, unknown> = { ...rest }
  if (elevation !== undefined) change.elevationM = elevationMOf(elevation, rest.elevationUnit)
  if (rest.magVarOverrideDeg === null) change.magVarOverrideReason = null
  const airfield = await transaction(async (tx) => {
    const [before] = await tx.select().from(schema.airfields).where(eq(schema.airfields.code, code)).for('update')
    if (!before) return null
    if (change.magVarOverrideDeg != null && !(change.magVarOverrideReason ?? before.magVarOverrideReason)) {
      throw invalid([{ field: 'magVarOverrideReason', message: 'Give a reason for overriding the magnetic variation' }], 'Give a reason for overriding the magnetic variation')
    }
    await tx.update(schema.airfields).set({ ...change, updatedAt: new Date() }).where(and(eq(schema.airfields.id, before.id), eq(schema.airfields.code, code)))
    const [after] = await tx.select().from(schema.airfields).where(eq(schema.airfields.id, before.id))
    const keys = Object.keys(change) as (keyof typeof before)[]
    await recordAudit(tx, { user }, 'airfield.update', 'airfield', before.id, {
      code, before: Object.fromEntries(keys.map(k => [k, before[k]])), after: Object.fromEntries(keys.map(k => [k, after![k]])),
    })
    return airfieldDetail(after!, tx)
  })
  if (!airfield) throw notFound(`No airfield with the code ${code}`)
  return airfield
}

const endTaken = (airfield: Airfield, ends: { designator: string }[]) => conflict(
  `${airfield.code} already has a runway end ${ends.map(e => e.designator).join(' or ')}`,
  [{ field: 'ends[0].designator', message: 'already in use at this airfield' }],
)

/** Adds a runway with both its ends; answers the new runway and the airfield as it now stands. */
export async function addRunway(user: User, airfield: Airfield, input: RunwayInput) {
  const ends = runwayEndValues(airfield, input)
  const runwayId = await transaction(async (tx) => {
    const [row] = await tx.insert(schema.runways).values({ airfieldId: airfield.id, lengthM: lengthOf(input) }).$returningId()
    await tx.insert(schema.runwayEnds).values(ends.map(e => ({ ...e, runwayId: row!.id })))
    await recordAudit(tx, { user }, 'runway.create', 'runway', row!.id, {
      airfieldCode: airfield.code, ends: ends.map(e => ({ designator: e.designator, trueHeadingDeg: e.trueHeadingDeg, headingSource: e.headingSource })),
    })
    return row!.id
  }).catch((err) => {
    if (isDuplicateKeyError(err)) throw endTaken(airfield, ends)
    throw err
  })
  const detail = await airfieldDetail(airfield)
  return { runway: detail.runways.find(r => r.id === runwayId), airfield: detail }
}

/** Replaces a runway's length and both ends (edited together so the pair stays consistent). */
export async function replaceRunway(user: User, airfield: Airfield, runwayId: number, input: RunwayInput) {
  const ends = runwayEndValues(airfield, input)
  const id = runwayId
  const found = await transaction(async (tx) => {
    const [runway] = await tx.select().from(schema.runways)
      .where(and(eq(schema.runways.id, id), eq(schema.runways.airfieldId, airfield.id))).for('update')
    if (!runway) return false
    const before = await tx.select().from(schema.runwayEnds).where(eq(schema.runwayEnds.runwayId, id)).orderBy(asc(schema.runwayEnds.id))
    await tx.update(schema.runways).set({ lengthM: lengthOf(input), updatedAt: new Date() })
      .where(and(eq(schema.runways.id, id), eq(schema.runways.airfieldId, airfield.id)))
    // Clear the designators first so swapping them within the runway does not trip the unique index.
    for (const [i, row] of before.entries()) {
      await tx.update(schema.runwayEnds).set({ designator: `~${i}` }).where(and(eq(schema.runwayEnds.id, row.id), eq(schema.runwayEnds.runwayId, id)))
    }
    for (const [i, row] of before.entries()) {
      await tx.update(schema.runwayEnds).set(ends[i]!).where(and(eq(schema.runwayEnds.id, row.id), eq(schema.runwayEnds.runwayId, id)))
    }
    await recordAudit(tx, { user }, 'runway.update', 'runway', id, {
      airfieldCode: airfield.code,
      before: before.map(e => ({ designator: e.designator, trueHeadingDeg: e.trueHeadingDeg })),
      after: ends.map(e => ({ designator: e.designator, trueHeadingDeg: e.trueHeadingDeg, headingSource: e.headingSource })),
    })
    return true
  }).catch((err) => {
    if (isDuplicateKeyError(err)) throw endTaken(airfield, ends)
    throw err
  })
  if (!found) throw notFound(`No runway ${id} at ${airfield.code}`)
  const detail = await airfieldDetail(airfield)
  return { runway: detail.runways.find(r => r.id === id), airfield: detail }
}
