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

/**
 * Claims the e-mails due for a (re)try: moves their next attempt five minutes on in the same
 * statement, with SKIP LOCKED, so two server processes never send the same e-mail twice; a
 * process that dies mid-send leaves the e-mail due again after those five minutes.
 */
export async function dueEmails(limit = 20) {
  const [rows] = await OutboundEmail.sequelize!.query(
    `UPDATE outbound_emails SET next_attempt_at = now() + interval '5 minutes'
      WHERE id IN (SELECT id FROM outbound_emails
                    WHERE status IN ('pending', 'failed') AND next_attempt_at <= now()
                    ORDER BY id LIMIT :limit FOR UPDATE SKIP LOCKED)
      RETURNING id, organisation_id, case_id, to_address, subject, attempts`,
    { replacements: { limit } },
  )
  return (rows as { id: number; organisation_id: number; case_id: number | null; to_address: string; subject: string; attempts: number }[])
    .sort((a, b) => a.id - b.id)
    .map((r) => ({ id: r.id, organisationId: r.organisation_id, caseId: r.case_id, toAddress: r.to_address, subject: r.subject, attempts: r.attempts }))
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

