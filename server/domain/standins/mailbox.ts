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
 * The messages the SMTP stand-in received, newest first, one page at a time, only where the stand-ins run (never in
 * production). `to` picks one exact recipient, `q` any recipient whose address contains it (both ignore case).
 * Invitation and reset links are masked unless the admin asks to reveal them, which is recorded in the audit.
 */
export async function mailboxView(admin: User, query: { to?: string, q?: string, page: number, pageSize: number, reveal: boolean }) {
  if (!standinsEnabled()) throw notFound('There is no mailbox stand-in in production')
  const to = query.to?.toLowerCase() || undefined
  const q = query.q?.toLowerCase() || undefined
  const recipients = (m: MailboxMessage) => [...m.envelopeTo, m.to].map(t => t.toLowerCase())
  const all = (await readMailbox()).filter(m => (!to || m.envelopeTo.some(t => t.toLowerCase() === to)) && (!q || recipients(m).some(t => t.includes(q))))
  const start = (query.page - 1) * query.pageSize
  const messages = all.reverse().slice(start, start + query.pageSize)
  if (query.reveal) await recordAudit(useDB(), { user: admin }, 'mailbox.reveal-links', 'mailbox', 'stand-in', { to: to ?? null, q: q ?? null, count: messages.length })
  return {
    messages: query.reveal ? messages : messages.map(m => ({ ...m, text: maskTokenLinks(m.text), html: m.html === null ? null : maskTokenLinks(m.html) })),
    total: all.length,
    page: query.page,
    pageSize: query.pageSize,
    pages: Math.max(1, Math.ceil(all.length / query.pageSize)),
    revealed: query.reveal,
  }
}
