export default defineEventHandler(async (event) => {
  await requireUser(event)
  await clearUserSession(event)
  setResponseStatus(event, 204)
  return null
})
