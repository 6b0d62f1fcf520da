import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { airfieldDetail, profileStateOf } from '../../domain/airfields'
import { airfieldByCode } from '../../domain/profiles/analysis'

export default defineApiHandler(async (event) => {
  await requireUser(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const airfield = await airfieldByCode(code)
  if (!airfield) throw createError({ statusCode: 404, statusMessage: `No airfield with the code ${code}` })
  return { airfield: { ...(await airfieldDetail(airfield)), profileState: await profileStateOf(airfield.id) } }
})
