export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const p = schema.pushSubscriptions
  const rows = await useDB().select({ id: p.id, label: p.label, endpoint: p.endpoint, createdAt: p.createdAt }).from(p).where(eq(p.userId, user.id)).orderBy(asc(p.id))
  return { subscriptions: rows }
})
