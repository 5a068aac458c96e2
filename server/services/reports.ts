// Service reports and their e-mail: the report model of a case (the page, the PDF and the e-mail
// share it), queueing it to the site's report contacts, and delivering each e-mail as a background
// job that pg-boss retries (after about 30 s, 1, 2, 4 and 8 min, then it stays failed).
import type { Transaction } from 'sequelize'
import type { CacheStamps } from '#server/db/repositories/cache-stamps'
import type { ServedFile } from '#server/utils/file-response'
import { findCase } from '#server/db/repositories/case-records'
import { appendEvents } from '#server/db/repositories/case-writes'
import { caseEmails, emailForDelivery, findEmail, insertEmails, recordAttempt, reportRecipients, setEmailJob, siteContactsOfUnit } from '#server/db/repositories/emails'
import { findUploadFile } from '#server/db/repositories/uploads'
import type { PdfPhoto } from '#server/utils/report-pdf'
import sharp from 'sharp'
import { listUsers, organisationSettings } from '#server/db/repositories/users'
import type { NewEvent } from '#server/domain/cases/case-record'
import { ConflictError, ForbiddenError, InvalidStateError, NotFoundError } from '#server/domain/errors'
import { refusedRecipients, refusedRecipientsMessage, reportRecipientList } from '#server/domain/reports/recipients'
import { buildServiceReport, reportEmailText } from '#server/domain/reports/service-report'
import type { CaseDto, EmailDto } from '#shared/types/cases'
import type { UnitDto } from '#shared/types/equipment-dto'
import type { ReportRecipient, ReportSendResult, ServiceReport } from '#shared/types/reports'
import { siteAtmosphere } from '#shared/utils/format'
import { can } from '#shared/utils/permissions'
import { knowledgeBaseTitles } from './diagnosis'
import { cancelJob, defineJob, enqueueJob } from './jobs'
import type { Actor } from './types'

/** Who the report of a case may go to without an engineer's or admin's say: the site's contacts and the organisation's active people. */
async function allowedRecipients(organisationId: number, unitId: number): Promise<ReportRecipient[]> {
  const [contacts, people] = await Promise.all([siteContactsOfUnit(organisationId, unitId), listUsers(organisationId)])
  return reportRecipientList(contacts, people.filter((p) => p.active))
}

async function reportOf(c: CaseDto, organisationId: number, stamps?: CacheStamps): Promise<ServiceReport> {
  const [org, titles, recipients] = await Promise.all([organisationSettings(organisationId), knowledgeBaseTitles(organisationId, stamps), allowedRecipients(organisationId, c.unit.id)])
  return buildServiceReport(c, { organisation: org.name, timeZone: org.timeZone, atmosphericKpa: siteAtmosphere(c.unit.siteAltitudeM).kpa, titles, recipients })
}

/** Longest side of a photo in the PDF, in pixels: sharp enough on paper, small enough to e-mail. */
const PDF_PHOTO_PX = 1400

/** The photos picked for the report, as JPEG for the PDF; a photo whose file is gone is left out. */
async function reportPhotos(organisationId: number, report: ServiceReport): Promise<PdfPhoto[]> {
  const out: PdfPhoto[] = []
  for (const photo of report.photos) {
    const record = await findUploadFile(organisationId, photo.id)
    if (!record) continue
    const raw = await useStorage('uploads').getItemRaw<ArrayBuffer | Uint8Array>(record.storageKey)
    if (!raw) continue
    const bytes = Buffer.isBuffer(raw) ? raw : Buffer.from(raw instanceof Uint8Array ? raw : new Uint8Array(raw))
    const jpeg = await sharp(bytes).rotate().resize(PDF_PHOTO_PX, PDF_PHOTO_PX, { fit: 'inside', withoutEnlargement: true }).flatten({ background: '#ffffff' }).jpeg({ quality: 80 }).toBuffer()
    out.push({ caption: photo.caption, bytes: jpeg })
  }
  return out
}

async function reportPdfBytes(organisationId: number, report: ServiceReport): Promise<Buffer> {
  return renderReportPdf(report, await reportPhotos(organisationId, report))
}

async function caseOf(organisationId: number, caseId: number): Promise<CaseDto> {
  const found = await findCase(organisationId, caseId)
  if (!found) throw new NotFoundError('Case not found')
  return found
}

/** `GET /api/cases/{id}/report`: the report model of a case of the actor's organisation. */
export async function serviceReport(actor: Actor, input: { caseId: number }): Promise<ServiceReport> {
  return reportOf(await caseOf(actor.organisationId, input.caseId), actor.organisationId, actor.cacheStamps)
}

/** `GET /api/cases/{id}/report.pdf`: the same report as a PDF, with the file name downloads and e-mails use. */
export async function serviceReportPdf(actor: Actor, input: { caseId: number }): Promise<ServedFile> {
  const report = await serviceReport(actor, input)
  return { bytes: await reportPdfBytes(actor.organisationId, report), mime: 'application/pdf', name: reportPdfName(input.caseId) }
}

/** Delivers one report e-mail; thrown errors are retried by the queue. */
export const reportEmailJob = defineJob<{ emailId: number }, { messageId: string } | { skipped: string }>('report-email', {
  retryLimit: 5,
  retryDelaySeconds: 30,
  retryBackoff: true,
  expireInSeconds: 120,
  async run({ emailId }, job) {
    const email = await emailForDelivery(emailId)
    if (!email || email.status === 'sent') return { skipped: email ? 'already sent' : 'the e-mail no longer exists' }
    const c = email.caseId ? await findCase(email.organisationId, email.caseId) : null
    if (!c) {
      await recordAttempt(email.id, { ok: false, error: 'The case of this e-mail no longer exists' })
      return { skipped: 'the case no longer exists' }
    }
    await job.progress(0.2)
    try {
      const report = await reportOf(c, email.organisationId)
      const pdf = await reportPdfBytes(email.organisationId, report)
      await job.progress(0.6)
      const info = await mailer().sendMail({
        from: mailFrom(), to: email.toAddress, subject: email.subject, text: reportEmailText(report),
        attachments: [{ filename: reportPdfName(c.id), content: pdf, contentType: 'application/pdf' }],
      })
      const at = new Date()
      await recordAttempt(email.id, { ok: true, messageId: info.messageId, at })
      await useDb().transaction((t) => appendEvents(c.id, null, [{ type: 'report-sent', payload: { to: email.toAddress, emailId: email.id } }], t, at))
      return { messageId: info.messageId as string }
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error)
      await recordAttempt(email.id, { ok: false, error: message })
      await useDb().transaction((t) => appendEvents(c.id, null, [{ type: 'report-failed', payload: { to: email.toAddress, error: message, willRetry: !job.finalAttempt } }], t))
      throw error
    }
  },
})

/**
 * Queues the service report of a case to `to` (default: the site's report contacts) inside the
 * caller's transaction, one delivery job per e-mail. Returns the ids and the timeline event to
 * append; nothing is queued when there is no recipient.
 */
export async function queueReportEmails(
  actor: Actor,
  target: { caseId: number; unit: Pick<UnitDto, 'id' | 'name'>; to?: string[] },
  transaction: Transaction,
): Promise<{ emailIds: number[]; jobIds: string[]; events: NewEvent[] }> {
  const to = target.to ?? (await reportRecipients(actor.organisationId, target.unit.id, transaction))
  if (!to.length) return { emailIds: [], jobIds: [], events: [] }
  const emailIds = await insertEmails(actor.organisationId, target.caseId, to, `Service report: ${target.unit.name} (case ${target.caseId})`, transaction)
  const jobIds: string[] = []
  for (const emailId of emailIds) {
    const jobId = await enqueueJob(reportEmailJob, { emailId }, { organisationId: actor.organisationId, createdBy: actor.id }, { transaction })
    await setEmailJob(emailId, jobId, transaction)
    jobIds.push(jobId)
  }
  return { emailIds, jobIds, events: [{ type: 'report-queued', payload: { to } }] }
}

/**
 * `POST /api/cases/{id}/report/send`: queues the report to the recipients picked on the preview, to
 * one address, or to the site's report contacts (422 when there are none). Picked addresses must be
 * the site's contacts or the organisation's people unless an engineer or admin sends it: otherwise
 * 403 naming each refused address, and nothing is queued.
 */
export async function sendServiceReport(actor: Actor, input: { caseId: number; to?: string; recipients?: string[] }, now: Date): Promise<ReportSendResult> {
  const c = await caseOf(actor.organisationId, input.caseId)
  const picked = input.recipients?.length ? [...new Set(input.recipients.map((r) => r.toLowerCase()))] : input.to ? [input.to.toLowerCase()] : undefined
  if (picked && !can(actor.role, 'reports:any-recipient')) {
    const refused = refusedRecipients(picked, await allowedRecipients(actor.organisationId, c.unit.id), false)
    if (refused.length) {
      const message = refusedRecipientsMessage(refused)
      throw new ForbiddenError(message, { [input.recipients?.length ? 'recipients' : 'to']: [message] })
    }
  }
  const queued = await useDb().transaction(async (transaction) => {
    const result = await queueReportEmails(actor, { caseId: c.id, unit: c.unit, to: picked }, transaction)
    if (!result.emailIds.length) throw new InvalidStateError('No one at this site receives reports. Enter an e-mail address to send it to.')
    await appendEvents(c.id, actor.id, result.events, transaction, now)
    return result
  })
  return { queued: queued.emailIds.length, emails: await caseEmails(actor.organisationId, c.id), jobIds: queued.jobIds }
}

/**
 * `POST /api/emails/{id}/retry`: delivers an e-mail not yet sent now, with a fresh set of retries;
 * a retry still waiting in the queue is replaced. 409 once it was sent.
 */
export async function retryEmail(actor: Actor, input: { emailId: number }): Promise<EmailDto> {
  return useDb().transaction(async (transaction) => {
    const email = await findEmail(actor.organisationId, input.emailId, transaction)
    if (!email) throw new NotFoundError('E-mail not found')
    if (email.status === 'sent') throw new ConflictError('This e-mail was already sent. Use "Send" on the report to send it again.')
    if (email.jobId) await cancelJob(reportEmailJob, email.jobId, 'Replaced by a retry started by hand', { transaction })
    const jobId = await enqueueJob(reportEmailJob, { emailId: email.id }, { organisationId: actor.organisationId, createdBy: actor.id }, { transaction })
    await setEmailJob(email.id, jobId, transaction)
    return { ...email, status: 'pending', jobId }
  })
}
