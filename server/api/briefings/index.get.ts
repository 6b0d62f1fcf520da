import { airfieldListQuerySchema } from '#shared/utils/airfield-schema'
import { briefingListJson, type BriefingListAnswer } from '../../domain/briefings/read'

// One page of the airfields with the state of their briefing now (the reader's followed airfields first): the
// profile in force and how many limits it crosses. `followed=1`: only those the reader follows.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'read-briefings')
  const query = readQuery(event, airfieldListQuerySchema)
  const answer = await briefingListJson({ q: query.q, page: query.page, pageSize: query.pageSize, followerId: user.id, onlyFollowed: query.followed },
    readStampOf(event)?.data ?? null)
  // JSON text shared by the requests that came together (gzip when asked); typed as what it spells for the pages.
  return jsonText(event, answer.key, answer.text) as unknown as BriefingListAnswer
})
