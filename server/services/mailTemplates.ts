// The words of every e-mail Dropwright sends: plain text first, and a simple HTML version in which every
// interpolated value is escaped. No markup from users ever reaches a message.
import { ROLE_LABELS, type Role } from '#shared/utils/roles'
import type { MailContent } from './mail'

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' }
export const escapeHtml = (value: string) => value.replace(/[&<>"']/g, c => HTML_ESCAPES[c]!)

/** Only absolute http(s) links become anchors; anything else is shown as text. */
const safeHref = (link: string) => (/^https?:\/\//i.test(link) ? link : null)

const SIGNATURE = '— Dropwright, chip design for droplet labs'

interface Message {
  subject: string
  lines: string[]
  action: { label: string; link: string }
  footnote?: string
}

function render({ subject, lines, action, footnote }: Message): MailContent {
  const text =
    [...lines.filter(Boolean), `${action.label}: ${action.link}`, ...(footnote ? [footnote] : []), SIGNATURE].join(
      '\n\n',
    ) + '\n'
  const href = safeHref(action.link)
  const paragraphs = lines.filter(Boolean).map(l => `<p style="margin:0 0 12px">${escapeHtml(l)}</p>`)
  const button = href
    ? `<p style="margin:20px 0"><a href="${escapeHtml(href)}" style="background:#1f6f8b;color:#ffffff;padding:8px 14px;border-radius:4px;text-decoration:none">${escapeHtml(action.label)}</a></p>` +
      `<p style="margin:0 0 12px;color:#647686;font-size:12px">${escapeHtml(href)}</p>`
    : `<p>${escapeHtml(action.label)}: ${escapeHtml(action.link)}</p>`
  const foot = footnote ? `<p style="margin:0 0 12px;color:#647686;font-size:12px">${escapeHtml(footnote)}</p>` : ''
  const html =
    `<!doctype html><html><body style="font-family:sans-serif;font-size:14px;color:#1a2027;max-width:560px">` +
    `${paragraphs.join('')}${button}${foot}<p style="color:#8595a3;font-size:12px">${escapeHtml(SIGNATURE)}</p></body></html>`
  return { subject, text, html }
}

const revisionLabel = (designName: string, revisionNumber: number) => `"${designName}" revision ${revisionNumber}`
const day = (date: Date) => date.toISOString().slice(0, 10)

export function invitationMail(p: {
  labName: string
  role: Role
  inviterName: string
  link: string
  expiresAt: Date
}): MailContent {
  return render({
    subject: `${p.inviterName} invited you to ${p.labName} on Dropwright`,
    lines: [
      `${p.inviterName} invited you to join ${p.labName} on Dropwright as ${ROLE_LABELS[p.role]}.`,
      'Open the link to accept. If you have no Dropwright account yet, you choose your name and password there.',
    ],
    action: { label: 'Accept the invitation', link: p.link },
    footnote: `The link works once and expires on ${day(p.expiresAt)}. If you did not expect this, ignore this message.`,
  })
}

export function reviewRequestedMail(p: {
  designName: string
  revisionNumber: number
  requesterName: string
  link: string
}): MailContent {
  return render({
    subject: `Review requested: ${revisionLabel(p.designName, p.revisionNumber)}`,
    lines: [`${p.requesterName} asked you to review ${revisionLabel(p.designName, p.revisionNumber)}.`],
    action: { label: 'Open the revision', link: p.link },
  })
}

export function newCommentMail(p: {
  designName: string
  revisionNumber: number
  commenterName: string
  excerpt: string
  link: string
}): MailContent {
  const excerpt = p.excerpt.length > 280 ? `${p.excerpt.slice(0, 279)}…` : p.excerpt
  return render({
    subject: `New comment on ${revisionLabel(p.designName, p.revisionNumber)}`,
    lines: [`${p.commenterName} commented on ${revisionLabel(p.designName, p.revisionNumber)}:`, excerpt],
    action: { label: 'Open the comment', link: p.link },
  })
}

export function verdictMail(p: {
  designName: string
  revisionNumber: number
  reviewerName: string
  verdict: 'approve' | 'request-changes'
  note?: string
  link: string
}): MailContent {
  const what = p.verdict === 'approve' ? 'approved' : 'asked for changes to'
  return render({
    subject: `${p.verdict === 'approve' ? 'Approved' : 'Changes requested'}: ${revisionLabel(p.designName, p.revisionNumber)}`,
    lines: [`${p.reviewerName} ${what} ${revisionLabel(p.designName, p.revisionNumber)}.`, ...(p.note ? [p.note] : [])],
    action: { label: 'Open the revision', link: p.link },
  })
}

export function releasedMail(p: {
  designName: string
  revisionNumber: number
  releasedByName: string
  labName: string
  link: string
}): MailContent {
  return render({
    subject: `Released for fabrication: ${revisionLabel(p.designName, p.revisionNumber)}`,
    lines: [
      `${p.releasedByName} of ${p.labName} released ${revisionLabel(p.designName, p.revisionNumber)} for fabrication.`,
      'The mask files and the fab sheet are ready to download.',
    ],
    action: { label: 'Open the release', link: p.link },
  })
}

export function passwordResetMail(p: { name: string; link: string; minutes: number }): MailContent {
  return render({
    subject: 'Reset your Dropwright password',
    lines: [
      `Hello ${p.name},`,
      'Someone (we hope you) asked to reset the password of your Dropwright account. Open the link to choose a new one; every place you are signed in is signed out when you do.',
    ],
    action: { label: 'Choose a new password', link: p.link },
    footnote: `The link works once and for ${p.minutes} minutes. If you did not ask for it, ignore this message: your password stays as it is.`,
  })
}

// ── fabrication orders and as-built reports ──
const orderLabel = (p: { orderNumber: number; designName: string; revisionNumber: number }) =>
  `order ${p.orderNumber} (${revisionLabel(p.designName, p.revisionNumber)})`

export function orderMovedMail(p: {
  orderNumber: number
  designName: string
  revisionNumber: number
  actorName: string
  statusLabel: string
  note: string
  trackingNumber: string | null
  link: string
}): MailContent {
  return render({
    subject: `${p.statusLabel}: ${orderLabel(p)}`,
    lines: [
      `${p.actorName} moved ${orderLabel(p)} to "${p.statusLabel}".`,
      p.trackingNumber ? `Tracking number: ${p.trackingNumber}` : '',
      p.note,
    ],
    action: { label: 'Open the order', link: p.link },
  })
}

export function orderMessageMail(p: {
  orderNumber: number
  designName: string
  revisionNumber: number
  actorName: string
  excerpt: string
  link: string
}): MailContent {
  const excerpt = p.excerpt.length > 280 ? `${p.excerpt.slice(0, 279)}…` : p.excerpt
  return render({
    subject: `New message on ${orderLabel(p)}`,
    lines: [`${p.actorName} wrote on ${orderLabel(p)}:`, excerpt],
    action: { label: 'Open the order', link: p.link },
  })
}

export function asBuiltMail(p: {
  designName: string
  revisionNumber: number
  actorName: string
  changes: string[]
  warnings: number
  link: string
}): MailContent {
  return render({
    subject: `As-built recorded: ${revisionLabel(p.designName, p.revisionNumber)}`,
    lines: [
      `${p.actorName} recorded what was actually made of ${revisionLabel(p.designName, p.revisionNumber)}; the forecast was recomputed on the as-built chip.`,
      ...p.changes.slice(0, 8),
      p.warnings
        ? `${p.warnings === 1 ? 'One change exceeds' : `${p.warnings} changes exceed`} the forecast method's uncertainty: check before the experiment.`
        : "No change exceeds the forecast method's uncertainty.",
    ],
    action: { label: 'Compare as-built and as-designed', link: p.link },
  })
}
