import type { KbVersionStatus } from '#shared/types/knowledge'

/** Where a knowledge-base version is, in words. */
export const KB_VERSION_STATUS_WORDS: Readonly<Record<KbVersionStatus, string>> = {
  draft: 'Draft',
  'in-review': 'In review',
  published: 'Published, in use',
  retired: 'Earlier version',
}

/** A version's status in words. */
export function kbVersionStatusLabel(status: KbVersionStatus): string {
  return KB_VERSION_STATUS_WORDS[status] ?? String(status)
}

/** What a knowledge-base audit entry records, in words. */
export const KB_AUDIT_ACTION_WORDS: Readonly<Record<string, string>> = {
  'draft-created': 'started the draft',
  'bundle-imported': 'imported a bundle as a draft',
  'finding-changed': 'changed finding',
  'finding-added': 'added finding',
  'finding-removed': 'removed finding',
  'cause-changed': 'changed cause',
  'test-changed': 'changed test',
  submitted: 'submitted it for review',
  approved: 'approved it',
  returned: 'returned it with comments',
  published: 'published it',
  republished: 'published it again (rollback)',
}

/** An audit action in words. */
export function kbAuditActionLabel(action: string): string {
  return KB_AUDIT_ACTION_WORDS[action] ?? action
}
