// Reads what the local SMTP stand-in received (scripts/standins/smtp.ts keeps it in a JSON file).
import { readFile } from 'node:fs/promises'
import { join, resolve } from 'node:path'

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
