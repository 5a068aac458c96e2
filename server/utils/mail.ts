import nodemailer from 'nodemailer'
import type { User } from '#auth-utils'
import { dueEmails, queueEmails, recordAttempt, reportRecipients } from '#server/db/repositories/emails'
import { appendEvents, findCase } from '#server/db/repositories/cases'
import { organisationName } from '#server/db/repositories/users'
import { buildServiceReport } from '#server/domain/reports/service-report'
import type { CaseDto } from '#shared/types/cases'
import { atmosphericPressureAtAltitude } from '#shared/utils/properties'

// Retry schedule after a failed send: 30 s, 2 min, 10 min, 1 h, 6 h, then it stays failed.
const RETRY_DELAYS_S = [30, 120, 600, 3600, 21600]
let transport: nodemailer.Transporter | undefined
let delivering: Promise<void> | undefined
let again = false

function mailer() {
  const { smtp } = useRuntimeConfig()
  transport ??= nodemailer.createTransport({ host: smtp.host, port: Number(smtp.port), secure: false, ignoreTLS: true, connectionTimeout: 5_000, greetingTimeout: 5_000 })
  return transport
}

/** The report model of a case, with the site's atmospheric pressure for gauge readings. */
export async function serviceReportOf(c: CaseDto, organisationId: number) {
  return buildServiceReport(c, await organisationName(organisationId), atmosphericPressureAtAltitude(c.unit.siteAltitudeM))
}

async function sendOne(email: Awaited<ReturnType<typeof dueEmails>>[number]) {
  const c = email.caseId ? await findCase(email.organisationId, email.caseId) : null
  if (!c) return recordAttempt(email.id, { ok: false, error: 'The case of this e-mail no longer exists', retryAt: null })
  try {
    const report = await serviceReportOf(c, email.organisationId)
    const pdf = await renderReportPdf(report)
    const lines = report.sections.flatMap((s) => [``, s.title.toUpperCase(), ...s.rows.map((r) => `${r.label}: ${r.value}${r.note ? ` (${r.note})` : ''}`)])
    const info = await mailer().sendMail({
      from: useRuntimeConfig().smtp.from,
      to: email.toAddress,
      subject: email.subject,
      text: [`${report.title} (${report.reference})`, `Technician: ${report.technician}`, ...lines, '', 'The full report is attached as a PDF.'].join('\n'),
      attachments: [{ filename: reportPdfName(c.id), content: pdf, contentType: 'application/pdf' }],
    })
    await recordAttempt(email.id, { ok: true, messageId: info.messageId })
    await useDb().transaction((t) => appendEvents(c.id, null, [{ type: 'report-sent', payload: { to: email.toAddress, emailId: email.id } }], t))
  } catch (error) {
    const delay = RETRY_DELAYS_S[email.attempts]
    const message = error instanceof Error ? error.message : String(error)
    await recordAttempt(email.id, { ok: false, error: message, retryAt: delay === undefined ? null : new Date(Date.now() + delay * 1000) })
    await useDb().transaction((t) => appendEvents(c.id, null, [{ type: 'report-failed', payload: { to: email.toAddress, error: message, willRetry: delay !== undefined } }], t))
  }
}

/**
 * Sends every e-mail that is due. Calls during a run share it, and the run goes round once more so
 * that e-mails queued meanwhile are not left for the retry timer. Never throws.
 */
export function deliverDueEmails(): Promise<void> {
  if (delivering) {
    again = true
    return delivering
  }
  delivering = (async () => {
    try {
      do {
        again = false
        for (const email of await dueEmails()) await sendOne(email)
      } while (again)
    } catch (error) {
      console.error('[mail] delivery run failed:', error instanceof Error ? error.message : error)
    } finally {
      delivering = undefined
    }
  })()
  return delivering
}

/**
 * Queues the service report of a case to the site's report contacts and starts delivery in the
 * background: closing a case never waits for, or fails because of, e-mail.
 */
export async function queueServiceReport(user: User, c: CaseDto, recipients?: string[]) {
  const to = recipients ?? (await reportRecipients(user.organisationId, c.unitId))
  if (!to.length) return []
  const ids = await queueEmails(user.organisationId, c.id, to, `Service report: ${c.unit.name} (case ${c.id})`)
  await useDb().transaction((t) => appendEvents(c.id, user.id, [{ type: 'report-queued', payload: { to } }], t))
  void deliverDueEmails()
  return ids
}
