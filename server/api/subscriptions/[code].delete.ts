import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { airfieldByCode } from '../../domain/profiles/analysis'

export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const airfield = await airfieldByCode(code)
  if (!airfield) throw createError({ statusCode: 404, statusMessage: `No airfield with the code ${code}` })
  const s = schema.alertSubscriptions
  const [result] = await useDB().delete(s).where(and(eq(s.userId, user.id), eq(s.airfieldId, airfield.id)))
  if (!result.affectedRows) throw createError({ statusCode: 404, statusMessage: `You do not follow ${code}` })
  setResponseStatus(event, 204)
  return null
})
