import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { briefingQuerySchema } from '#shared/utils/briefing-schemas'
import { readBriefing, type BriefingAnswer } from '../../../domain/briefings/read'

// The runway briefing of an airfield: the profile valid now (or at ?at=, or the version ?profile=), every role;
// ?end= details one runway end (what the page shows), every end by default.
// Answered from the analysis cache as JSON text, with a weak ETag (304 when the reader already has it).
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'read-briefings')
  const params = readParams(event, airfieldCodeParamSchema)
  const query = readQuery(event, briefingQuerySchema)
  const read = await readBriefing(params.code, user.id, { at: query.at, profileId: query.profile, precision: query.precision, end: query.end,
    stamp: readStampOf(event) })
  if (read.kind === 'no-airfield') throw notFound(`No airfield with the code ${read.code}`)
  if (read.kind === 'no-such-profile') throw notFound(`Profile ${read.profileId} is not a profile of ${read.code}`)
  setResponseHeader(event, 'etag', read.etag)
  setResponseHeader(event, 'cache-control', 'private, no-cache')
  // The header as Node parsed it (h3's getRequestHeader copies every header first).
  if (event.node.req.headers['if-none-match'] === read.etag) return sendNoContent(event, 304)
  // JSON text spliced from the cache (gzip when asked, once per shared read); typed as what it spells for the pages.
  return jsonText(event, read.memoKey, read.body) as unknown as BriefingAnswer
})
