import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { loadAirfield } from '../../domain/airfields/lookup'

export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const airfield = await loadAirfield(code)
  const s = schema.alertSubscriptions
  const [result] = await useDB().delete(s).where(and(eq(s.userId, user.id), eq(s.airfieldId, airfield.id)))
  if (!result.affectedRows) throw createError({ statusCode: 404, statusMessage: `You do not follow ${code}` })
  setResponseStatus(event, 204)
  return null
})
