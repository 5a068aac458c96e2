// The knowledge-base authoring API's shapes: versions, bundles' answers, impact on past cases.

/** Where a version is: being edited, waiting for review, the one in use, or an older one kept as history. */
export const KB_VERSION_STATUSES = ['draft', 'in-review', 'published', 'retired'] as const
export type KbVersionStatus = (typeof KB_VERSION_STATUSES)[number]

/** One version of the organisation's knowledge base (`GET /api/knowledge-base/versions`). */
export interface KbVersionDto {
  id: number
  status: KbVersionStatus
  label: string
  createdAt: string
  /** Who made it (name), null for a version made by a script. */
  createdBy: string | null
  createdById: number | null
  publishedAt: string | null
  publishedBy: string | null
  /** The version a draft was copied from. */
  basedOnId: number | null
  submittedAt: string | null
  submittedBy: string | null
  reviewedAt: string | null
  reviewedBy: string | null
  /** The reviewer's comments when a draft was returned. */
  reviewComment: string | null
  /** Moves on with every change; edits send the revision or item version they saw. */
  revision: number
}

/** `POST /api/knowledge-base/bundles`: the draft made from the bundle. */
export interface ImportedBundleDto {
  id: number
  status: 'draft'
}

/** `POST /api/knowledge-base/versions/{id}/impact`: the job that works it out. */
export interface ImpactJobDto {
  jobId: string
}

export interface CauseRef {
  cause: string
  stage?: string
}

export interface TopShares {
  /** Fraction of the cases whose first cause is a confirmed one (0 with no cases). */
  top1: number
  top3: number
  top1Cases: number
  top3Cases: number
}

export interface ConfusionRow {
  /** The confirmed cause (every stage together). */
  cause: string
  cases: number
  /** How many of these cases each version put which cause first. */
  candidateFirst: Record<string, number>
  publishedFirst: Record<string, number>
  candidateTop1: number
  publishedTop1: number
}

/** The result of an impact job: the candidate version against the published one on past cases. */
export interface ImpactResult {
  cases: number
  candidate: TopShares
  published: TopShares
  /** Cases whose first cause (cause and stage) differs between the two versions, by id. */
  changedFirst: number[]
  confusion: ConfusionRow[]
  candidateVersionId?: number
  publishedVersionId?: number | null
}

/**
 * The published version's accuracy as last measured: by the impact replay (default starting odds,
 * every closed case with a confirmed cause) or by the accuracy report (the organisation's learned
 * starting odds, the most recent confirmed cases), whichever finished last for this version.
 */
export interface PublishedAccuracyDto {
  versionId: number
  source: 'impact' | 'accuracy'
  cases: number
  top1: number
  top3: number
  measuredAt: string
}

/** One worked example of a finding as "Check" ran it. */
export interface ExampleCheckDto {
  finding: string
  index: number
  title: string
  passed: boolean
  problems: string[]
}

/** A scenario of the repository's suite the version does not put first. */
export interface ScenarioFailureDto {
  id: string
  title: string
  source: string
  expected: CauseRef
  /** Where the expected cause came (0 when not ranked at all). */
  rank: number
  firstThree: CauseRef[]
  /** True when the published version ranks it first: the version under check made it worse. */
  newFailure: boolean
}

/** `POST …/versions/{id}/check`: every example and the scenario suite against a version. */
export interface VersionCheckDto {
  examples: { total: number; failed: ExampleCheckDto[] }
  scenarios: { total: number; top1: number; top2: number; publishedTop1: number | null; failures: ScenarioFailureDto[] }
  passed: boolean
}

/** A finding as stored and edited: a json-rules-engine rule whose event carries the likelihood table. */
export interface KbFindingJson {
  name: string
  subject?: string
  stages?: string[]
  conditions: Record<string, unknown>
  // The event's params are checked by the knowledge-base schema on the server; editors hold them loosely.
  event: { type: 'finding'; params: Record<string, any> }
}

/** `GET …/versions/{id}/content`: every item of a version with the lock version an edit sends back. */
export interface KbItemsDto {
  version: KbVersionDto
  causes: ({ slug: string; title: string; description: string; lockVersion: number } & Record<string, unknown>)[]
  tests: ({ slug: string; title: string; procedure: string; lockVersion: number } & Record<string, unknown>)[]
  findings: { finding: KbFindingJson; examples: unknown[]; lockVersion: number }[]
}

export type DiffItemKind = 'cause' | 'test' | 'finding'

export interface FieldChange {
  path: string
  before?: unknown
  after?: unknown
}

export interface DiffItem {
  kind: DiffItemKind
  key: string
  change: 'added' | 'removed' | 'changed'
  fields: FieldChange[]
}

/** `GET …/versions/{id}/diff`. */
export interface KbDiffDto {
  against: number | null
  items: DiffItem[]
}
