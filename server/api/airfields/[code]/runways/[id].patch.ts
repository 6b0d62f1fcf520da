import { z } from 'zod'
import { airfieldCodeSchema, runwaySchema } from '#shared/utils/airfield-schema'
import { idSchema } from '#shared/utils/input-schemas'
import { airfieldDetail, runwayEndValues } from '../../../../domain/airfields'
import { loadAirfield } from '../../../../domain/airfields/lookup'

const paramsSchema = z.object({ code: airfieldCodeSchema, id: idSchema('runway id') })

// Replaces a runway's length and both ends (the ends are edited together so the pair stays consistent).
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const { code, id } = readParams(event, paramsSchema)
  const body = await readBodyWith(event, runwaySchema)
  const airfield = await loadAirfield(code)
  const ends = runwayEndValues(airfield, body)
  try {
    const found = await useDB().transaction(async (tx) => {
      const [runway] = await tx.select().from(schema.runways)
        .where(and(eq(schema.runways.id, id), eq(schema.runways.airfieldId, airfield.id))).for('update')
      if (!runway) return false
      const before = await tx.select().from(schema.runwayEnds).where(eq(schema.runwayEnds.runwayId, id)).orderBy(asc(schema.runwayEnds.id))
      await tx.update(schema.runways).set({ lengthM: body.lengthM ?? null, updatedAt: new Date() })
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
    })
    if (!found) throw createError({ statusCode: 404, statusMessage: `No runway ${id} at ${airfield.code}` })
  }
  catch (err) {
    if (isDuplicateKeyError(err)) throw createError({ statusCode: 409, statusMessage: `${airfield.code} already has a runway end ${ends.map(e => e.designator).join(' or ')}` })
    throw err
  }
  const detail = await airfieldDetail(airfield)
  return { runway: detail.runways.find(r => r.id === id), airfield: detail }
})
