import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { briefingQuerySchema } from '#shared/utils/briefing-schemas'
import { loadBriefing } from '../../../domain/briefings/briefing'
import { receiptOf } from '../../../domain/briefings/receipts'

// The runway briefing of an airfield: the profile valid now (or at ?at=, or the version ?profile=), every role.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'admin', 'dispatcher', 'pilot', 'safety')
  const params = await getValidatedRouterParams(event, airfieldCodeParamSchema.safeParse)
  if (!params.success) throw validationError(params.error, 'The airfield code is not valid')
  const query = await getValidatedQuery(event, briefingQuerySchema.safeParse)
  if (!query.success) throw validationError(query.error, 'The briefing query is not valid')
  const result = await loadBriefing(params.data.code, { at: query.data.at, profileId: query.data.profile })
  const receipt = result.briefing ? await receiptOf(user.id, result.briefing.profile.id) : null
  return { ...result, receipt }
})
