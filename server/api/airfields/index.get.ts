import { airfieldListQuerySchema } from '#shared/utils/airfield-schema'
import { airfieldListJson, type AirfieldListAnswer } from '../../domain/airfields/list-read'

// One page of the airfields (search on code or name) with the profile in force now (or the next one).
export default defineApiHandler(async (event) => {
  await requireUser(event)
  const query = readQuery(event, airfieldListQuerySchema)
  const answer = await airfieldListJson({ q: query.q, page: query.page, pageSize: query.pageSize }, readStampOf(event)?.data ?? null)
  // JSON text shared by the requests that came together (gzip when asked); typed as what it spells for the pages.
  return jsonText(event, answer.key, answer.text) as unknown as AirfieldListAnswer
})
