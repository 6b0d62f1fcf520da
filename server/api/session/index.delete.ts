// Signs this browser out: its session row goes (server/plugins/security.ts ends it on clear) and the cookie is emptied.
export default defineApiHandler(async (event) => {
  await requireUser(event)
  await clearUserSession(event)
  setResponseStatus(event, 204)
  return null
})
