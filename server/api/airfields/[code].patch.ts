import { airfieldCodeParamSchema, airfieldUpdateSchema } from '#shared/utils/airfield-schema'
import { M_PER_FT } from '#shared/units'
import { airfieldDetail } from '../../domain/airfields'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const { code } = readParams(event, airfieldCodeParamSchema)
  const body = await readBodyWith(event, airfieldUpdateSchema)
  const { elevation, ...rest } = body
  const change: Record<string, unknown> = { ...rest }
  if (elevation !== undefined) change.elevationM = rest.elevationUnit === 'ft' ? elevation * M_PER_FT : elevation
  if (rest.magVarOverrideDeg === null) change.magVarOverrideReason = null

  const airfield = await useDB().transaction(async (tx) => {
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
  return { airfield }
})
