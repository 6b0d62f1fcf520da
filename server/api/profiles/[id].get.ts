import { idParamSchema } from '#shared/utils/schemas'
import { readProfile } from '../../domain/profiles/records'

// One profile as filed, with its history links (what it superseded, what superseded it and for which time).
export default defineApiHandler(async (event) => {
  await requireUser(event)
  const { id } = readParams(event, idParamSchema)
  return { profile: await readProfile(id) }
})
