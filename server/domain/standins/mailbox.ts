// Reads what the local SMTP stand-in received (scripts/standins/smtp.ts keeps it in a JSON file).
import { readFile } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import type { User } from '../../db/schema'
import { useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { notFound } from '../../utils/errors'
import { maskTokenLinks, standinsEnabled } from '../alerts/standins'

export const mailboxFile = () => process.env.VEERLINE_MAILBOX_FILE || join(resolve(process.env.VEERLINE_DATA_DIR || '.data'), 'standins', 'mailbox.json')

export interface MailboxMessage {
  id: string
  receivedAt: string
  envelopeTo: string[]
  deliveryId: string | null
  kind: string | null
  from: string
  to: string
  subject: string
  text: string
  html: string | null
}

export async function readMailbox(): Promise<MailboxMessage[]> {
  try {
    return JSON.parse(await readFile(mailboxFile(), 'utf8'))
  }
  catch {
    return []
  }
}

/**
 * The messages the SMTP stand-in received, newest first, only where the stand-ins run (never in production).
 * Invitation and reset links are masked unless the admin asks to reveal them, which is recorded in the audit.
 */
export async function mailboxView(admin: User, query: { to?: string, limit: number, reveal: boolean }) {
  if (!standinsEnabled()) throw notFound('There is no mailbox stand-in in production')
  const to = query.to?.toLowerCase()
  const all = (await readMailbox()).filter(m => !to || m.envelopeTo.some(t => t.toLowerCase() === to))
  const messages = all.reverse().slice(0, query.limit)
  if (query.reveal) await recordAudit(useDB(), { user: admin }, 'mailbox.reveal-links', 'mailbox', 'stand-in', { to: to ?? null, count: messages.length })
  return {
    messages: query.reveal ? messages : messages.map(m => ({ ...m, text: maskTokenLinks(m.text), html: m.html === null ? null : maskTokenLinks(m.html) })),
    total: all.length,
    revealed: query.reveal,
  }
}
