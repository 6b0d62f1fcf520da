import { z } from 'zod'
import { readMailbox } from '../../domain/standins/mailbox'

const querySchema = z.object({ to: z.string().trim().max(254).optional(), limit: z.coerce.number().int().min(1).max(1000).default(200) })

// The messages the local SMTP stand-in received, newest first. Admins only.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin')
  const query = await getValidatedQuery(event, querySchema.safeParse)
  if (!query.success) throw validationError(query.error)
  const to = query.data.to?.toLowerCase()
  const all = (await readMailbox()).filter(m => !to || m.envelopeTo.some(t => t.toLowerCase() === to))
  return { messages: all.reverse().slice(0, query.data.limit), total: all.length }
})
