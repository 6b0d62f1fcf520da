// Local SMTP stand-in for the hosted mail service: accepts every message on 127.0.0.1:$VEERLINE_SMTP_PORT and keeps
// it in $VEERLINE_DATA_DIR/standins/mailbox.json (the app's admin-only mailbox page reads that file).
// SIGUSR1 stops listening (connections are refused, as with a mail server that is down); SIGUSR2 listens again.
import { writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import { readJson, smtpPort, standinDir, writeJson } from './lib/common'

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

const MAX_KEPT = 1000
const file = join(standinDir(), 'mailbox.json')
const port = smtpPort()
writeFileSync(join(standinDir(), 'smtp.pid'), String(process.pid))

function makeServer() {
  return new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Veerline SMTP stand-in',
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream).then((mail) => {
        const header = (name: string) => {
          const v = mail.headers.get(name)
          return v == null ? null : String(v)
        }
        const box = readJson<StoredMail[]>(file, [])
        box.push({
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
        })
        writeJson(file, box.slice(-MAX_KEPT))
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
