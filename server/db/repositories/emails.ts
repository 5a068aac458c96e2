// Report e-mails and their delivery state. Delivery itself is a background job per e-mail.
import { Op, type Transaction } from 'sequelize'
import type { EmailDto } from '#shared/types/cases'
import { Contact, OutboundEmail, Unit } from '../models'
import { normaliseMessageId } from '#server/domain/outbox/outbox-message'

/** An e-mail row as the API shows it. */
export function emailDto(e: OutboundEmail): EmailDto {
  return {
    id: e.id, toAddress: e.toAddress, subject: e.subject, status: e.status, attempts: e.attempts, lastError: e.lastError,
    sentAt: e.sentAt ? e.sentAt.toISOString() : null, jobId: e.jobId ?? null,
  }
}

/** Report recipients of a unit's site. */
export async function reportRecipients(organisationId: number, unitId: number, transaction?: Transaction): Promise<string[]> {
  const unit = await Unit.findOne({ where: { id: unitId, organisationId }, transaction })
  if (!unit) return []
  const contacts = await Contact.findAll({ where: { organisationId, siteId: unit.siteId, receivesReports: true }, transaction })
  return contacts.map((c) => c.email)
}

/** The contacts of a unit's site with an e-mail address, those who receive reports first. */
export async function siteContactsOfUnit(organisationId: number, unitId: number): Promise<{ name: string; email: string; receivesReports: boolean }[]> {
  const unit = await Unit.findOne({ where: { id: unitId, organisationId } })
  if (!unit) return []
  const contacts = await Contact.findAll({ where: { organisationId, siteId: unit.siteId }, order: [['receivesReports', 'DESC'], ['name', 'ASC']] })
  return contacts.filter((c) => c.email).map((c) => ({ name: c.name, email: c.email, receivesReports: c.receivesReports }))
}

/** Records one pending report e-mail per recipient; returns their ids. */
export async function insertEmails(organisationId: number, caseId: number, to: string[], subject: string, transaction: Transaction): Promise<number[]> {
  const rows = await OutboundEmail.bulkCreate(
    to.map((toAddress) => ({ organisationId, caseId, toAddress, subject, lastError: null, messageId: null, nextAttemptAt: null, sentAt: null })),
    { transaction },
  )
  return rows.map((r) => r.id)
}

/** Remembers the job that delivers an e-mail, and makes it pending again. */
export async function setEmailJob(id: number, jobId: string, transaction: Transaction) {
  await OutboundEmail.update({ jobId, status: 'pending' }, { where: { id }, transaction })
}

/** What the delivery job needs of one e-mail, or null when it is gone. */
export async function emailForDelivery(id: number) {
  const e = await OutboundEmail.findByPk(id)
  return e ? { id: e.id, organisationId: e.organisationId, caseId: e.caseId, toAddress: e.toAddress, subject: e.subject, status: e.status } : null
}

/** Records the outcome of a delivery attempt. */
export async function recordAttempt(id: number, outcome: { ok: true; messageId: string; at: Date } | { ok: false; error: string }) {
  const row = await OutboundEmail.findByPk(id)
  if (!row) return
  if (outcome.ok) await row.update({ status: 'sent', attempts: row.attempts + 1, messageId: outcome.messageId, sentAt: outcome.at, lastError: null })
  else await row.update({ status: 'failed', attempts: row.attempts + 1, lastError: outcome.error })
}

/** One e-mail of the organisation as the API shows it, or null. */
export async function findEmail(organisationId: number, id: number, transaction?: Transaction): Promise<EmailDto | null> {
  const row = await OutboundEmail.findOne({ where: { id, organisationId }, transaction })
  return row ? emailDto(row) : null
}

/** The e-mails of one case, oldest first. */
export async function caseEmails(organisationId: number, caseId: number): Promise<EmailDto[]> {
  const rows = await OutboundEmail.findAll({ where: { organisationId, caseId }, order: [['id', 'ASC']] })
  return rows.map(emailDto)
}

/** Message-IDs of the organisation's sent e-mails, normalised (see normaliseMessageId). */
export async function sentMessageIds(organisationId: number): Promise<Set<string>> {
  const rows = await OutboundEmail.findAll({ where: { organisationId, messageId: { [Op.ne]: null } }, attributes: ['messageId'] })
  return new Set(rows.map((r) => normaliseMessageId(r.messageId!)))
}
