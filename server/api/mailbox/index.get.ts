import { z } from 'zod'
import { decimalIntSchema } from '#shared/utils/input-schemas'
import { readMailbox } from '../../domain/standins/mailbox'
import { maskTokenLinks, standinsEnabled } from '../../domain/alerts/standins'

const querySchema = z.object({
  to: z.string().trim().max(254).optional(),
  limit: decimalIntSchema('limit', 1, 1000).default(200),
  reveal: z.enum(['0', '1', 'true', 'false']).optional(),
})

// The messages the local SMTP stand-in received, newest first. Admins only, and only where the stand-ins run (never
// in production). Invitation and reset links are masked unless the admin asks to reveal them (recorded in the audit).
export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'read-mailbox')
  if (!standinsEnabled()) throw notFound('There is no mailbox stand-in in production')
  const query = readQuery(event, querySchema)
  const to = query.to?.toLowerCase()
  const reveal = query.reveal === '1' || query.reveal === 'true'
  const all = (await readMailbox()).filter(m => !to || m.envelopeTo.some(t => t.toLowerCase() === to))
  const messages = all.reverse().slice(0, query.limit)
  if (reveal) await recordAudit(useDB(), { user: admin }, 'mailbox.reveal-links', 'mailbox', 'stand-in', { to: to ?? null, count: messages.length })
  return {
    messages: reveal ? messages : messages.map(m => ({ ...m, text: maskTokenLinks(m.text), html: m.html === null ? null : maskTokenLinks(m.html) })),
    total: all.length,
    revealed: reveal,
  }
})
