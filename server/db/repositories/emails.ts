import { Op } from 'sequelize'
import type { EmailDto } from '#shared/types/cases'
import { Contact, OutboundEmail, Unit } from '../models'
import { normaliseMessageId } from '#server/domain/outbox/outbox-message'
import { emailDto } from './cases'

/** Report recipients of a unit's site. */
export async function reportRecipients(organisationId: number, unitId: number): Promise<string[]> {
  const unit = await Unit.findOne({ where: { id: unitId, organisationId } })
  if (!unit) return []
  const contacts = await Contact.findAll({ where: { organisationId, siteId: unit.siteId, receivesReports: true } })
  return contacts.map((c) => c.email)
}

/** Queues one report e-mail per recipient. */
export async function queueEmails(organisationId: number, caseId: number, to: string[], subject: string) {
  const rows = await OutboundEmail.bulkCreate(to.map((toAddress) => ({ organisationId, caseId, toAddress, subject, lastError: null, messageId: null, nextAttemptAt: new Date(), sentAt: null })))
  return rows.map((r) => r.id)
}

/** E-mails due for a (re)try. */
export async function dueEmails(limit = 20) {
  const rows = await OutboundEmail.findAll({
    where: { status: { [Op.in]: ['pending', 'failed'] }, nextAttemptAt: { [Op.lte]: new Date() } },
    order: [['id', 'ASC']],
    limit,
  })
  return rows.map((r) => ({ id: r.id, organisationId: r.organisationId, caseId: r.caseId, toAddress: r.toAddress, subject: r.subject, attempts: r.attempts }))
}

/** Records the outcome of a delivery attempt. */
export async function recordAttempt(id: number, outcome: { ok: true; messageId: string } | { ok: false; error: string; retryAt: Date | null }) {
  const row = await OutboundEmail.findByPk(id)
  if (!row) return
  if (outcome.ok) await row.update({ status: 'sent', attempts: row.attempts + 1, messageId: outcome.messageId, sentAt: new Date(), lastError: null, nextAttemptAt: null })
  else await row.update({ status: 'failed', attempts: row.attempts + 1, lastError: outcome.error, nextAttemptAt: outcome.retryAt })
}

/** One e-mail of the organisation as the API shows it, or null. */
export async function findEmail(organisationId: number, id: number): Promise<EmailDto | null> {
  const row = await OutboundEmail.findOne({ where: { id, organisationId } })
  return row ? emailDto(row) : null
}

/** Makes an unsent e-mail of the organisation due now; returns its state before, or null if absent. */
export async function makeEmailDue(organisationId: number, id: number): Promise<EmailDto['status'] | null> {
  const row = await OutboundEmail.findOne({ where: { id, organisationId } })
  if (!row) return null
  if (row.status !== 'sent') await row.update({ nextAttemptAt: new Date() })
  return row.status
}

/** Message-IDs of the organisation's sent e-mails, normalised (see normaliseMessageId). */
export async function sentMessageIds(organisationId: number): Promise<Set<string>> {
  const rows = await OutboundEmail.findAll({ where: { organisationId, messageId: { [Op.ne]: null } }, attributes: ['messageId'] })
  return new Set(rows.map((r) => normaliseMessageId(r.messageId!)))
}

