import { airfieldListJson, type AirfieldListAnswer } from '../../domain/airfields/list-read'

// Every airfield with the profile in force now (or the next one), for the airfield list.
export default defineApiHandler(async (event) => {
  await requireUser(event)
  const answer = await airfieldListJson()
  // JSON text shared by the requests that came together (gzip when asked); typed as what it spells for the pages.
  return jsonText(event, 'airfield-list', answer.text) as unknown as AirfieldListAnswer
})
