// The words of every notice Veerline sends: alert raised / cleared (e-mail and push), invitation, password reset.
// Plain functions: data in, text out. Every alert notice carries the caution.
import { VEERLINE_CAUTION } from '../../../shared/utils/caution'
import { figureText, KIND_WORDS, withUnit } from '../../../shared/limits'

export interface AlertNoticeData {
  event: 'raised' | 'cleared'
  airfield: { code: string, name: string }
  designator: string
  kind: string
  value: number
  limit: number
  unit: string
  excess: number
  message: string
  clearReason?: string | null
  profile: { id: number, validFrom: Date, validTo: Date, source: string }
  appUrl: string
}

export const kindTitle = (kind: string) => (KIND_WORDS as Record<string, string>)[kind] ?? kind

export const utc = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')}Z`
const limitText = (d: Pick<AlertNoticeData, 'limit' | 'unit'>) => withUnit(d.limit, d.unit === 'F' ? '' : d.unit)
const where = (designator: string) => designator ? `runway ${designator}` : 'airfield-wide'
const escapeHtml = (s: string) => s.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' }[c]!))

export function briefingLink(d: Pick<AlertNoticeData, 'appUrl' | 'airfield' | 'profile'>) {
  return `${d.appUrl.replace(/\/$/, '')}/briefings/${d.airfield.code}?profile=${d.profile.id}`
}

export function alertTitle(d: AlertNoticeData) {
  return d.event === 'raised'
    ? d.unit === 'report'
      ? `${d.airfield.code} ${where(d.designator)}: ${kindTitle(d.kind)} in a coded report`
      : `${d.airfield.code} ${where(d.designator)}: ${kindTitle(d.kind)} ${figureText(d.value, d.unit)} over the ${limitText(d)} limit`
    : `${d.airfield.code} ${where(d.designator)}: ${kindTitle(d.kind)} all clear`
}

export function renderAlertEmail(d: AlertNoticeData) {
  const link = briefingLink(d)
  const subject = `[Veerline] ${alertTitle(d)}`
  const facts: [string, string][] = [
    ['Airfield', `${d.airfield.code} ${d.airfield.name}`],
    ['Runway end', d.designator || 'airfield-wide figure'],
    ['Figure', kindTitle(d.kind)],
    ['Value', figureText(d.value, d.unit)],
    ['Limit', d.unit === 'report' ? 'any report of wind shear' : limitText(d)],
    [d.excess > 0 ? 'Over the limit by' : 'Margin to the limit', d.unit === 'report' ? '-' : figureText(Math.abs(d.excess), d.unit)],
    ['Valid', `${utc(d.profile.validFrom)} to ${utc(d.profile.validTo)}`],
    ['Profile', `#${d.profile.id} (${d.profile.source})`],
  ]
  const lead = d.event === 'raised' ? d.message : (d.clearReason || 'All clear')
  const text = [
    d.event === 'raised' ? 'Limit crossed' : 'All clear',
    '',
    lead,
    '',
    ...facts.map(([k, v]) => `${k}: ${v}`),
    '',
    `Briefing: ${link}`,
    '',
    `Caution: ${VEERLINE_CAUTION}`,
  ].join('\n')
  const rows = facts.map(([k, v]) => `<tr><th align="left" style="padding:2px 8px 2px 0">${escapeHtml(k)}</th><td style="font-family:monospace">${escapeHtml(v)}</td></tr>`).join('')
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#081a1d">
<h2 style="color:${d.event === 'raised' ? '#9c2a16' : '#1d4b48'}">${d.event === 'raised' ? 'Limit crossed' : 'All clear'}</h2>
<p>${escapeHtml(lead)}</p>
<table>${rows}</table>
<p><a href="${escapeHtml(link)}">Open the briefing for ${escapeHtml(d.airfield.code)}</a></p>
<p style="border-left:4px solid #d99a1c;background:#fbefd2;padding:6px 8px;font-size:12px"><strong>Caution</strong> ${escapeHtml(VEERLINE_CAUTION)}</p>
</body></html>`
  return { subject, text, html }
}

export function renderAlertPush(d: AlertNoticeData) {
  return {
    title: alertTitle(d),
    body: d.event === 'raised'
      ? `${d.message}. Valid ${utc(d.profile.validFrom)} to ${utc(d.profile.validTo)}.`
      : (d.clearReason || 'All clear'),
    url: briefingLink(d).replace(/^https?:\/\/[^/]+/, ''),
    event: d.event,
    airfield: d.airfield.code,
    designator: d.designator,
    kind: d.kind,
    value: d.unit === 'F' ? Math.round(d.value * 1000) / 1000 : Math.round(d.value * 100) / 100,
    limit: d.limit,
    unit: d.unit,
    profileId: d.profile.id,
    caution: VEERLINE_CAUTION,
  }
}

export function renderTokenEmail(purpose: 'invitation' | 'password-reset', d: { name: string, link: string, expiresAt: Date, invitedBy?: string }) {
  if (purpose === 'invitation') {
    const subject = '[Veerline] You are invited: set your password'
    const text = `Hello ${d.name},\n\n${d.invitedBy ?? 'An administrator'} has invited you to Veerline.\nSet your password here (the link works once, until ${utc(d.expiresAt)}):\n\n${d.link}\n`
    return { subject, text, html: `<p>Hello ${escapeHtml(d.name)},</p><p>${escapeHtml(d.invitedBy ?? 'An administrator')} has invited you to Veerline.</p><p><a href="${escapeHtml(d.link)}">Set your password</a> (works once, until ${utc(d.expiresAt)}).</p>` }
  }
  const subject = '[Veerline] Reset your password'
  const text = `Hello ${d.name},\n\nSomeone asked to reset your Veerline password. If it was you, choose a new one here (the link works once, until ${utc(d.expiresAt)}):\n\n${d.link}\n\nIf it was not you, ignore this message.\n`
  return { subject, text, html: `<p>Hello ${escapeHtml(d.name)},</p><p>Someone asked to reset your Veerline password. <a href="${escapeHtml(d.link)}">Choose a new password</a> (works once, until ${utc(d.expiresAt)}).</p><p>If it was not you, ignore this message.</p>` }
}
