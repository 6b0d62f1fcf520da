import { M_PER_FT } from '#shared/units'
import { airfieldCreateSchema } from '#shared/utils/airfield-schema'
import { airfieldDetail } from '../../domain/airfields'
import { findAirfield } from '../../domain/airfields/lookup'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const body = await readBodyWith(event, airfieldCreateSchema)
  const { elevation, ...rest } = body
  const values = {
    ...rest,
    elevationM: rest.elevationUnit === 'ft' ? elevation * M_PER_FT : elevation,
    magVarOverrideDeg: rest.magVarOverrideDeg ?? null,
    magVarOverrideReason: rest.magVarOverrideDeg == null ? null : (rest.magVarOverrideReason ?? null),
    notes: rest.notes ?? null,
  }
  const duplicate = () => createError({ statusCode: 409, statusMessage: `An airfield with the code ${values.code} already exists`, data: { issues: [{ field: 'code', message: 'already in use' }] } })
  if (await findAirfield(values.code)) throw duplicate()
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
