// Local SMTP stand-in for the hosted mail service: accepts every message on 127.0.0.1:$VEERLINE_SMTP_PORT and appends
// it, one JSON line per message, to $VEERLINE_DATA_DIR/standins/mailbox.jsonl (the app's admin-only mailbox page
// reads that file a page at a time, newest first). Every message is kept; a file past 64 MB moves aside at start.
// SIGUSR1 stops listening (connections are refused, as with a mail server that is down); SIGUSR2 listens again.
// A number of milliseconds in standins/smtp-delay-ms holds every message that long before accepting it (the
// delivery tests use it to catch a worker mid-batch).
import { writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import { appendJsonLine, controlNumber, rotateIfLarge, smtpPort, standinDir } from './lib/common'

export interface StoredMail {
  id: string
  receivedAt: string
  envelopeFrom: string
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

const file = join(standinDir(), 'mailbox.jsonl')
const delayFile = join(standinDir(), 'smtp-delay-ms')
const port = smtpPort()
rotateIfLarge(file)
writeFileSync(join(standinDir(), 'smtp.pid'), String(process.pid))

function makeServer() {
  return new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Veerline SMTP stand-in',
    // On SIGUSR1 open connections are told 421 and closed within half a second: the outage is real for a pool too.
    closeTimeout: 500,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream).then(async (mail) => {
        const delayMs = controlNumber(delayFile)
        if (delayMs) await new Promise(r => setTimeout(r, delayMs))
        const header = (name: string) => {
          const v = mail.headers.get(name)
          return v == null ? null : String(v)
        }
        const stored: StoredMail = {
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          envelopeTo: session.envelope.rcptTo.map(r => r.address),
          messageId: mail.messageId ?? null,
          deliveryId: header('x-veerline-delivery'),
          kind: header('x-veerline-kind'),
          from: mail.from?.text ?? '',
          to: Array.isArray(mail.to) ? mail.to.map(t => t.text).join(', ') : (mail.to?.text ?? ''),
          subject: mail.subject ?? '',
          text: mail.text ?? '',
          html: typeof mail.html === 'string' ? mail.html : null,
        }
        appendJsonLine(file, stored)
        callback()
      }, err => callback(err))
    },
  })
}

let server: SMTPServer | null = null
function start() {
  if (server) return
  server = makeServer()
  server.on('error', err => console.error('[smtp stand-in]', err.message))
  server.listen(port, '127.0.0.1', () => console.log(`[smtp stand-in] listening on 127.0.0.1:${port}, keeping mail in ${file}`))
}
function stop() {
  if (!server) return
  const s = server
  server = null
  s.close(() => console.log('[smtp stand-in] stopped listening'))
}

// Keeps the process alive while it is not listening.
setInterval(() => {}, 1 << 30)
process.on('SIGUSR1', stop)
process.on('SIGUSR2', start)
process.on('SIGTERM', () => {
  stop()
  process.exit(0)
})
process.on('SIGINT', () => process.exit(0))
start()
