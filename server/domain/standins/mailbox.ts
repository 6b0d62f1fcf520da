// Reads what the local SMTP stand-in received (scripts/standins/smtp.ts appends one JSON line per message to
// mailbox.jsonl). The file is read backwards in blocks, so a page of the newest messages costs the same however long
// the run has been; counting every match (`total`) reads the rest of the file but parses only matching lines.
import { open } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import type { User } from '../../db/schema'
import { useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { notFound } from '../../utils/errors'
import { maskTokenLinks, standinsEnabled } from '../alerts/standins'

export const mailboxFile = () => process.env.VEERLINE_MAILBOX_FILE || join(resolve(process.env.VEERLINE_DATA_DIR || '.data'), 'standins', 'mailbox.jsonl')

export interface MailboxMessage {
  id: string
  receivedAt: string
  envelopeTo: string[]
  messageId: string | null
  deliveryId: string | null
  kind: string | null
  from: string
  to: string
  subject: string
  text: string
  html: string | null
}

/** The lines of a file from the last to the first, read in blocks of `blockBytes`. */
export async function* linesBackward(file: string, blockBytes = 256 * 1024): AsyncGenerator<string> {
  let handle
  try {
    handle = await open(file, 'r')
  }
  catch {
    return
  }
  try {
    let position = (await handle.stat()).size
    let rest = Buffer.alloc(0)
    while (position > 0) {
      const size = Math.min(blockBytes, position)
      position -= size
      const block = Buffer.alloc(size)
      await handle.read(block, 0, size, position)
      let buf = Buffer.concat([block, rest])
      let end = buf.length
      for (let i = buf.length - 1; i >= 0; i--) {
        if (buf[i] !== 0x0A) continue
        if (end > i + 1) yield buf.subarray(i + 1, end).toString('utf8')
        end = i
      }
      rest = buf.subarray(0, end)
      buf = Buffer.alloc(0)
    }
    if (rest.length) yield rest.toString('utf8')
  }
  finally {
    await handle.close()
  }
}

export interface MailboxPage { messages: MailboxMessage[], total: number, page: number, pageSize: number }

/** One page of the mailbox, newest first, optionally only what was sent to `to` (an envelope recipient). */
export async function readMailboxPage(opts: { to?: string, page?: number, pageSize?: number, deliveryId?: string } = {}): Promise<MailboxPage> {
  const page = Math.max(1, opts.page ?? 1)
  const pageSize = Math.max(1, opts.pageSize ?? 50)
  const to = opts.to?.toLowerCase()
  const skip = (page - 1) * pageSize
  const messages: MailboxMessage[] = []
  let total = 0
  for await (const line of linesBackward(mailboxFile())) {
    // A cheap text test first: most lines of a long run are not the ones asked for and are never parsed.
    if (to && !line.toLowerCase().includes(to)) continue
    if (opts.deliveryId && !line.includes(opts.deliveryId)) continue
    let m: MailboxMessage
    try {
      m = JSON.parse(line)
    }
    catch {
      continue
    }
    if (to && !m.envelopeTo.some(t => t.toLowerCase() === to)) continue
    if (opts.deliveryId && m.deliveryId !== opts.deliveryId) continue
    total++
    if (total > skip && messages.length < pageSize) messages.push(m)
  }
  return { messages, total, page, pageSize }
}

/**
 * The messages the SMTP stand-in received, newest first, only where the stand-ins run (never in production).
 * Invitation and reset links are masked unless the admin asks to reveal them, which is recorded in the audit.
 */
export async function mailboxView(admin: User, query: { to?: string, limit: number, reveal: boolean, page?: number, deliveryId?: string }) {
  if (!standinsEnabled()) throw notFound('There is no mailbox stand-in in production')
  const { messages, total, page, pageSize } = await readMailboxPage({ to: query.to, page: query.page, pageSize: query.limit, deliveryId: query.deliveryId })
  if (query.reveal) await recordAudit(useDB(), { user: admin }, 'mailbox.reveal-links', 'mailbox', 'stand-in', { to: query.to?.toLowerCase() ?? null, count: messages.length })
  return {
    messages: query.reveal ? messages : messages.map(m => ({ ...m, text: maskTokenLinks(m.text), html: m.html === null ? null : maskTokenLinks(m.html) })),
    total,
    page,
    pageSize,
    revealed: query.reveal,
  }
}
