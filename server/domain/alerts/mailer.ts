// Outgoing mail over SMTP with nodemailer: one pooled transport per instance (a few long-lived connections, many
// messages each), so a fan-out does not open a connection per message. Defaults point at the local stand-in
// (scripts/standins/smtp.ts).
import nodemailer, { type Transporter } from 'nodemailer'

export function smtpUrl(env: NodeJS.ProcessEnv = process.env) {
  return env.VEERLINE_SMTP_URL || `smtp://127.0.0.1:${env.VEERLINE_SMTP_PORT || 2525}`
}
export const mailFrom = () => process.env.VEERLINE_MAIL_FROM || 'Veerline alerts <alerts@veerline.example>'

let transport: Transporter | undefined
function useTransport() {
  if (!transport) {
    const url = new URL(smtpUrl())
    const loopback = ['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname)
    transport = nodemailer.createTransport({
      host: url.hostname.replace(/^\[|\]$/g, ''),
      port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 25)),
      secure: url.protocol === 'smtps:',
      // The loopback stand-in speaks plain SMTP; anything else upgrades with STARTTLS unless told otherwise.
      ignoreTLS: loopback && process.env.VEERLINE_SMTP_REQUIRE_TLS !== '1',
      pool: true,
      // As many connections as the worker sends at once (VEERLINE_OUTBOX_EMAIL_CONCURRENCY).
      maxConnections: Number(process.env.VEERLINE_OUTBOX_EMAIL_CONCURRENCY) || 8,
      maxMessages: 1000,
      auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 10_000,
    })
  }
  return transport
}

/** The Message-ID of a delivery: the same for every copy of it, so a receiver (or a mail client) can drop a resend. */
export const deliveryMessageId = (deliveryId: string) => `<${deliveryId}@delivery.veerline.example>`

export async function sendMail(m: { to: string, subject: string, text: string, html?: string | null, headers?: Record<string, string>, deliveryId?: string }) {
  const info = await useTransport().sendMail({ from: mailFrom(), to: m.to, subject: m.subject, text: m.text, html: m.html ?? undefined, headers: m.headers,
    messageId: m.deliveryId ? deliveryMessageId(m.deliveryId) : undefined })
  if (info.rejected?.length) throw new Error(`the mail server refused ${info.rejected.join(', ')}`)
  return info.messageId as string
}

/** Closes the pooled connections (at stop). */
export function closeMail() {
  transport?.close()
  transport = undefined
}
