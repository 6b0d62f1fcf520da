import { briefingListJson, type BriefingListAnswer } from '../../domain/briefings/read'

// Every airfield with the state of its briefing now: the profile in force and how many limits it crosses.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-briefings')
  const text = await briefingListJson()
  setResponseHeader(event, 'content-type', 'application/json; charset=utf-8')
  // JSON text shared by the requests that came together; typed as what it spells for the pages' fetches.
  return text as unknown as BriefingListAnswer
})
