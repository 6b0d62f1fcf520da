import { idParamSchema } from '#shared/utils/schemas'

// Puts a failed delivery back in the queue, due now.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'read-alert-log')
  const { id } = readParams(event, idParamSchema)
  const o = schema.outbox
  const [result] = await useDB().update(o).set({ state: 'queued', nextAttemptAt: new Date(), updatedAt: new Date() })
    .where(and(eq(o.id, id), eq(o.state, 'failed')))
  if (!result.affectedRows) throw createError({ statusCode: 404, statusMessage: `No failed delivery #${id}` })
  await recordAudit(useDB(), { user }, 'outbox.retry', 'outbox', id)
  return { id, state: 'queued' }
})
