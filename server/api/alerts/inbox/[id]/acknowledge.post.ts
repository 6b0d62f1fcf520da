import { idParamSchema } from '#shared/utils/schemas'

// Acknowledges one of the signed-in user's own inbox entries (404 for anyone else's).
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = readParams(event, idParamSchema)
  const i = schema.alertInbox
  const now = new Date()
  const [result] = await useDB().update(i).set({ acknowledgedAt: now }).where(and(eq(i.id, id), eq(i.userId, user.id), isNull(i.acknowledgedAt)))
  if (!result.affectedRows) {
    const [mine] = await useDB().select({ acknowledgedAt: i.acknowledgedAt }).from(i).where(and(eq(i.id, id), eq(i.userId, user.id)))
    if (!mine) throw createError({ statusCode: 404, statusMessage: `No inbox entry #${id} of yours` })
    return { id, acknowledgedAt: mine.acknowledgedAt }
  }
  return { id, acknowledgedAt: now }
})
