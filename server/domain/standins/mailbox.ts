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

export interface MailboxPage { messages: MailboxMessage[], total: number, page: number, pageSize: number, pages: number }

/**
 * One page of the mailbox, newest first: `to` picks one exact envelope recipient, `q` any recipient (envelope or
 * header) whose address contains it (both ignore case), `deliveryId` the copies of one delivery.
 */
export async function readMailboxPage(opts: { to?: string, q?: string, page?: number, pageSize?: number, deliveryId?: string } = {}): Promise<MailboxPage> {
  const page = Math.max(1, opts.page ?? 1)
  const pageSize = Math.max(1, opts.pageSize ?? 50)
  const to = opts.to?.toLowerCase() || undefined
  const q = opts.q?.toLowerCase() || undefined
  const skip = (page - 1) * pageSize
  const messages: MailboxMessage[] = []
  let total = 0
  for await (const line of linesBackward(mailboxFile())) {
    // A cheap text test first: most lines of a long run are not the ones asked for and are never parsed.
    if (to && !line.toLowerCase().includes(to)) continue
    if (q && !line.toLowerCase().includes(q)) continue
    if (opts.deliveryId && !line.includes(opts.deliveryId)) continue
    let m: MailboxMessage
    try {
      m = JSON.parse(line)
    }
    catch {
      continue
    }
    if (to && !m.envelopeTo.some(t => t.toLowerCase() === to)) continue
    if (q && ![...m.envelopeTo, m.to].some(t => t.toLowerCase().includes(q))) continue
    if (opts.deliveryId && m.deliveryId !== opts.deliveryId) continue
    total++
    if (total > skip && messages.length < pageSize) messages.push(m)
  }
  return { messages, total, page, pageSize, pages: Math.max(1, Math.ceil(total / pageSize)) }
}

/**
 * The messages the SMTP stand-in received, newest first, one page at a time, only where the stand-ins run (never in
 * production). `to` picks one exact recipient, `q` any recipient whose address contains it (both ignore case).
 * Invitation and reset links are masked unless the admin asks to reveal them, which is recorded in the audit.
 */
export async function mailboxView(admin: User, query: { to?: string, q?: string, deliveryId?: string, page: number, pageSize: number, reveal: boolean }) {
  if (!standinsEnabled()) throw notFound('There is no mailbox stand-in in production')
  const { messages, total, page, pageSize, pages } = await readMailboxPage({ to: query.to, q: query.q, page: query.page, pageSize: query.pageSize, deliveryId: query.deliveryId })
  if (query.reveal) await recordAudit(useDB(), { user: admin }, 'mailbox.reveal-links', 'mailbox', 'stand-in', { to: query.to?.toLowerCase() ?? null, q: query.q?.toLowerCase() ?? null, count: messages.length })
  return {
    messages: query.reveal ? messages : messages.map(m => ({ ...m, text: maskTokenLinks(m.text), html: m.html === null ? null : maskTokenLinks(m.html) })),
    total,
    page,
    pageSize,
    pages,
    revealed: query.reveal,
  }
}
