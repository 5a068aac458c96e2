// Who a service report may go to. It carries the customer's data and the sender's words, so it goes
// to the site's contacts and the organisation's own people; an engineer or an admin may also add
// any other address (a customer's head office, an auditor).
import type { ReportRecipient } from '#shared/types/reports'

/** The report's possible recipients: the site's contacts first, then colleagues not already listed. */
export function reportRecipientList(
  contacts: readonly { name: string; email: string; receivesReports: boolean }[],
  colleagues: readonly { name: string; email: string }[],
): ReportRecipient[] {
  const seen = new Set<string>()
  const out: ReportRecipient[] = []
  for (const c of contacts) {
    const key = c.email.toLowerCase()
    if (!c.email || seen.has(key)) continue
    seen.add(key)
    out.push({ name: c.name, email: c.email, preselected: c.receivesReports, kind: 'contact' })
  }
  for (const p of colleagues) {
    const key = p.email.toLowerCase()
    if (!p.email || seen.has(key)) continue
    seen.add(key)
    out.push({ name: p.name, email: p.email, preselected: false, kind: 'colleague' })
  }
  return out
}

/** The picked addresses (lower-cased, in order, once each) that are not on the list; none when any address is allowed. */
export function refusedRecipients(picked: readonly string[], allowed: readonly ReportRecipient[], anyAddress: boolean): string[] {
  if (anyAddress) return []
  const known = new Set(allowed.map((r) => r.email.toLowerCase()))
  return [...new Set(picked.map((p) => p.trim().toLowerCase()))].filter((p) => !known.has(p))
}

/** The refusal, naming every address that was refused. */
export function refusedRecipientsMessage(refused: readonly string[]): string {
  const list = refused.join(', ')
  return `A report goes only to this site's contacts and your organisation's people; ${refused.length === 1 ? `${list} is` : `${list} are`} neither. Ask an engineer or an admin to send it there.`
}
