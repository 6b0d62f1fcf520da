import { airfieldCreateSchema } from '#shared/utils/airfield-schema'
import { airfieldDetail } from '../../domain/airfields'
import { airfieldByCode } from '../../domain/profiles/analysis'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const body = await readBodyWith(event, airfieldCreateSchema)
  const { elevation, ...rest } = body
  const values = {
    ...rest,
    elevationM: rest.elevationUnit === 'ft' ? elevation * 0.3048 : elevation,
    magVarOverrideDeg: rest.magVarOverrideDeg ?? null,
    magVarOverrideReason: rest.magVarOverrideDeg == null ? null : (rest.magVarOverrideReason ?? null),
    notes: rest.notes ?? null,
  }
  const duplicate = () => createError({ statusCode: 409, statusMessage: `An airfield with the code ${values.code} already exists`, data: { issues: [{ field: 'code', message: 'already in use' }] } })
  if (await airfieldByCode(values.code)) throw duplicate()
  try {
    const airfield = await useDB().transaction(async (tx) => {
      const [row] = await tx.insert(schema.airfields).values(values).$returningId()
      await recordAudit(tx, { user }, 'airfield.create', 'airfield', row!.id, { code: values.code, name: values.name })
      const [a] = await tx.select().from(schema.airfields).where(eq(schema.airfields.id, row!.id))
      return airfieldDetail(a!, tx)
    })
    setResponseStatus(event, 201)
    return { airfield }
  }
  catch (err) {
    if (isDuplicateKeyError(err)) throw duplicate()
    throw err
  }
})
