// States and kinds of things people follow: a case, a report e-mail, a background job, a refrigerant
// transaction, a stored file.
import type { CaseStatus, EmailDto } from '#shared/types/cases'
import type { JobState } from '#shared/types/jobs'
import type { UploadPurpose } from '#shared/utils/uploads'
import { labelOf, type WordForm, type WordLabel } from './words'

/** A case's state; `long` reads as a sentence subject ("Open case"). */
export const CASE_STATE_WORDS: Readonly<Record<CaseStatus, WordLabel>> = {
  open: { short: 'Open', long: 'Open case' },
  closed: { short: 'Closed', long: 'Closed case' },
}

/** "Open" / "Closed case". */
export function caseStateLabel(status: CaseStatus, form: WordForm = 'short'): string {
  return CASE_STATE_WORDS[status]?.[form] ?? String(status)
}

/** Delivery state of one report e-mail. */
export const EMAIL_STATE_WORDS: Readonly<Record<EmailDto['status'], WordLabel>> = {
  pending: { short: 'Waiting to send', long: 'Waiting to be sent' },
  sent: { short: 'Sent', long: 'Sent to the recipient' },
  failed: { short: 'Not delivered', long: 'Not delivered yet' },
}

/** "Sent". */
export function emailStateLabel(status: EmailDto['status'], form: WordForm = 'short'): string {
  return EMAIL_STATE_WORDS[status]?.[form] ?? String(status)
}

/** State of background work (report delivery, replays, imports). */
export const JOB_STATE_WORDS: Readonly<Record<JobState, WordLabel>> = {
  queued: { short: 'Waiting', long: 'Waiting to start' },
  running: { short: 'Running', long: 'In progress' },
  done: { short: 'Done', long: 'Finished' },
  failed: { short: 'Failed', long: 'Stopped with an error' },
}

/** "In progress". */
export function jobStateLabel(state: JobState, form: WordForm = 'short'): string {
  return JOB_STATE_WORDS[state]?.[form] ?? String(state)
}

/** Which way refrigerant went in a transaction. */
export const DIRECTION_WORDS: Readonly<Record<'added' | 'recovered', WordLabel>> = {
  added: { short: 'Added', long: 'Added to the stage' },
  recovered: { short: 'Recovered', long: 'Recovered from the stage' },
}

/** "Added" / "Recovered". */
export function directionLabel(direction: 'added' | 'recovered', form: WordForm = 'short'): string {
  return DIRECTION_WORDS[direction]?.[form] ?? String(direction)
}

/** What a stored photo or PDF shows. */
export const UPLOAD_PURPOSE_WORDS: Readonly<Record<UploadPurpose, WordLabel>> = {
  photo: { short: 'Photo', long: 'A photo of the work' },
  nameplate: { short: 'Nameplate', long: 'The nameplate' },
  document: { short: 'Document', long: 'A document (certificate, report)' },
}

/** "Nameplate"; an unknown purpose reads as a phrase. */
export function uploadPurposeLabel(purpose: string, form: WordForm = 'short'): string {
  return labelOf((UPLOAD_PURPOSE_WORDS as Record<string, WordLabel>)[purpose], purpose, form)
}
