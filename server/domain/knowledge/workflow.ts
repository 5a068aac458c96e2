/**
 * The life of a knowledge-base version: a draft is edited, submitted for review, approved or
 * returned with comments by someone other than its author, and published; publishing retires the
 * version in use, and publishing a retired version again is a rollback. What each step may do is
 * decided here; the service stores what these functions return.
 */
import { ConflictError, ForbiddenError, InvalidStateError } from '#server/domain/errors'
import type { KbVersionStatus } from '#shared/types/knowledge'

export interface VersionState {
  id: number
  status: KbVersionStatus
  createdBy: number | null
  submittedBy: number | null
  reviewedBy: number | null
  publishedAt: Date | null
  revision: number
}

const STATUS_WORDS: Record<KbVersionStatus, string> = { draft: 'a draft', 'in-review': 'in review', published: 'published', retired: 'retired' }

/** Content may change only while a version is a draft. */
export function assertEditable(v: VersionState): void {
  if (v.status !== 'draft') throw new InvalidStateError(`Version ${v.id} is ${STATUS_WORDS[v.status]}; only a draft can be changed. Start a new draft from it.`)
}

/** A change sent with the revision its author saw is refused when the version moved on since. */
export function assertRevision(v: VersionState, expected: number | undefined): void {
  if (expected !== undefined && expected !== v.revision) {
    throw new ConflictError(`Version ${v.id} was changed by someone else since you opened it (revision ${v.revision}, yours ${expected}). Reload it and check their changes.`)
  }
}

/** Who wrote the version: its creator and whoever submitted it. */
export function authorsOf(v: VersionState): number[] {
  return [v.createdBy, v.submittedBy].filter((x): x is number => x !== null)
}

export interface StatusChange {
  status: KbVersionStatus
  submittedBy?: number | null
  submittedAt?: Date | null
  reviewedBy?: number | null
  reviewedAt?: Date | null
  reviewComment?: string | null
}

/** Submitting a draft for review. */
export function planSubmit(v: VersionState, actorId: number, now: Date, expectedRevision?: number): StatusChange {
  assertEditable(v)
  assertRevision(v, expectedRevision)
  return { status: 'in-review', submittedBy: actorId, submittedAt: now, reviewedBy: null, reviewedAt: null, reviewComment: null }
}

/** A review: approved (ready to publish) or returned to draft with comments; never by the version's author. */
export function planReview(v: VersionState, actorId: number, decision: 'approve' | 'return', comment: string, now: Date): StatusChange {
  if (v.status !== 'in-review') throw new InvalidStateError(`Version ${v.id} is ${STATUS_WORDS[v.status]}; only a version in review can be reviewed.`)
  if (authorsOf(v).includes(actorId)) throw new ForbiddenError('You wrote this version; another engineer or an administrator must review it.')
  if (v.reviewedBy !== null) throw new ConflictError(`Version ${v.id} has already been approved.`)
  if (decision === 'return') return { status: 'draft', reviewedBy: actorId, reviewedAt: now, reviewComment: comment }
  return { status: 'in-review', reviewedBy: actorId, reviewedAt: now, reviewComment: comment || null }
}

/**
 * Publishing: an approved version in review, or a version published before (a rollback to it).
 * Never the version already in use.
 */
export function assertPublishable(v: VersionState): void {
  if (v.status === 'published') throw new ConflictError(`Version ${v.id} is already the published version.`)
  if (v.status === 'retired' && v.publishedAt !== null) return
  if (v.status === 'in-review' && v.reviewedBy !== null) return
  if (v.status === 'in-review') throw new InvalidStateError(`Version ${v.id} waits for its review; it can be published once another engineer approves it.`)
  throw new InvalidStateError(`Version ${v.id} is ${STATUS_WORDS[v.status]}; submit it for review first.`)
}
