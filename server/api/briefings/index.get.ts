import { briefingListJson, type BriefingListAnswer } from '../../domain/briefings/read'

// Every airfield with the state of its briefing now: the profile in force and how many limits it crosses.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-briefings')
  const answer = await briefingListJson()
  // JSON text shared by the requests that came together (gzip when asked); typed as what it spells for the pages.
  return jsonText(event, 'briefing-list', answer.text) as unknown as BriefingListAnswer
})
