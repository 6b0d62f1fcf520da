import { idParamSchema } from '#shared/utils/schemas'

export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = readParams(event, idParamSchema)
  const p = schema.pushSubscriptions
  const [result] = await useDB().delete(p).where(and(eq(p.id, id), eq(p.userId, user.id)))
  if (!result.affectedRows) throw createError({ statusCode: 404, statusMessage: `No push subscription #${id} of yours` })
  setResponseStatus(event, 204)
  return null
})
