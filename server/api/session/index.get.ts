export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  return { user: sessionUser(user) }
})
