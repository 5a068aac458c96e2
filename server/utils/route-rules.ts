// Who may call each API route, what each route parameter names, and what body a write takes.
// Every file under server/api has exactly one entry here, keyed by its method and its path as the
// file names it ('POST /api/cases/[id]/notes' for server/api/cases/[id]/notes.post.ts; an
// index file is its folder). The route guard (server/middleware/route-guard.ts) enforces each entry
// before the handler runs, an /api request matching no entry is refused, and the authorization
// matrix test calls every route as every role of the route's organisation and of another one.
//
// To add a route: add a line below.
//   allow   'public' (anyone), 'signed-in' (any active user) or a permission of
//           shared/utils/permissions.ts (a list: any one of them). The handler's requireUser asks
//           for the same permission.
//   records each [param] of the path: the kind of record it names. Kinds in RECORD_TABLES are
//           looked up in the caller's organisation before the handler runs (another organisation's
//           record, or an id beyond the column's range, is a 404); 'outbox-message' is checked by its
//           service; 'global' names shared reference data and 'index' a key or position within the
//           record named before it (its service answers 404 for one that is not there).
//   personal  true when the service further limits the record to the person it belongs to (and
//           trainers): within the organisation others get 404, or 403 for what only the owner may do.
//   body    for POST, PUT, PATCH and DELETE: 'json' (default), 'multipart' (file uploads), 'csv' (a
//           data-logger file sent as the body itself: text/csv, text/plain or octet-stream) or 'none'.
//           A body of another type is refused with 415, a JSON body over MAX_JSON_BYTES with 413.
//   maxBytes  a larger limit for this route's body (uploads).
//   limit   a rate limit (server/services/rate-limits.ts) each signed-in caller's calls count against.
import type { RatePolicyName } from '#server/services/rate-limits'
import type { Permission } from '#shared/utils/permissions'
import { UPLOAD_MAX_BYTES } from '#shared/utils/uploads'

/** Records looked up by id in the caller's organisation, with their table and id column type. */
export const RECORD_TABLES = {
  cases: { table: 'cases', id: 'integer' },
  units: { table: 'units', id: 'integer' },
  sites: { table: 'sites', id: 'integer' },
  customers: { table: 'customers', id: 'integer' },
  contacts: { table: 'contacts', id: 'integer' },
  uploads: { table: 'uploads', id: 'integer' },
  emails: { table: 'outbound_emails', id: 'integer' },
  users: { table: 'users', id: 'integer' },
  jobs: { table: 'background_jobs', id: 'uuid' },
  'kb-versions': { table: 'kb_versions', id: 'integer' },
  exercises: { table: 'exercises', id: 'integer' },
  'exercise-attempts': { table: 'exercise_attempts', id: 'integer' },
  cylinders: { table: 'cylinders', id: 'integer' },
  'logger-files': { table: 'logger_files', id: 'integer' },
} as const

export type RecordTableKind = keyof typeof RECORD_TABLES
export type RecordKind = RecordTableKind | 'outbox-message' | 'global' | 'index'

export interface RouteRule {
  allow: 'public' | 'signed-in' | Permission | readonly Permission[]
  records?: Readonly<Record<string, RecordKind>>
  body?: 'json' | 'multipart' | 'csv' | 'none'
  maxBytes?: number
  personal?: boolean
  /** Counts each call by the signed-in person against this limit of server/services/rate-limits.ts (429 with Retry-After beyond it). */
  limit?: RatePolicyName
  /** Set for a route a module registers instead of a file under server/api. */
  providedBy?: string
}

/** The largest JSON body any route reads. */
export const MAX_JSON_BYTES = 1024 * 1024
/** Multipart bodies: one file of at most the upload limit and its form fields. */
export const MAX_UPLOAD_BYTES = UPLOAD_MAX_BYTES + 1024 * 1024
/** A data-logger CSV: 64 MB (a million rows of several columns fit in about 50 MB). */
export const MAX_LOGGER_BYTES = 64 * 1024 * 1024
/** A whole knowledge base as one JSON bundle. */
export const MAX_BUNDLE_BYTES = 8 * 1024 * 1024

export const ROUTE_RULES = {
  // Signing in and out, and the session module's own routes.
  'POST /api/auth/login': { allow: 'public' },
  'POST /api/auth/logout': { allow: 'public', body: 'none' },
  'GET /api/auth/me': { allow: 'signed-in' },
  'POST /api/auth/password': { allow: 'signed-in', limit: 'account' },
  'GET /api/_auth/session': { allow: 'public', providedBy: 'nuxt-auth-utils' },
  'DELETE /api/_auth/session': { allow: 'public', body: 'none', providedBy: 'nuxt-auth-utils' },
  'GET /api/health': { allow: 'public' },
  // The first administrator of a deployment without the demo, through a one-time link.
  'GET /api/setup': { allow: 'public' },
  'POST /api/setup': { allow: 'public' },
  // Any other /api path answers a JSON 404.
  '* /api/[...]': { allow: 'public', records: { '...': 'global' }, body: 'none' },

  // Users of the organisation.
  'GET /api/admin/users': { allow: 'users:manage' },
  'POST /api/admin/users': { allow: 'users:manage', limit: 'account' },
  'PATCH /api/admin/users/[id]': { allow: 'users:manage', records: { id: 'users' }, limit: 'account' },

  // Calculations and reference data.
  'POST /api/calculations/charging': { allow: 'calculator:use' },
  'POST /api/calculations/co2e': { allow: 'calculator:use' },
  'POST /api/calculations/leak-rate': { allow: 'calculator:use' },
  'POST /api/calculations/standing-pressure': { allow: 'calculator:use' },
  'POST /api/calculations/substitution': { allow: 'calculator:use' },
  'GET /api/conversions/measurement': { allow: 'calculator:use' },
  'GET /api/units-conversion': { allow: 'calculator:use' },
  'GET /api/refrigerants': { allow: 'calculator:use' },
  'GET /api/refrigerants/[designation]': { allow: 'calculator:use', records: { designation: 'global' } },
  'GET /api/refrigerants/[designation]/saturation': { allow: 'calculator:use', records: { designation: 'global' } },

  // Cases.
  'GET /api/cases': { allow: 'cases:read' },
  'POST /api/cases': { allow: 'cases:work' },
  'GET /api/cases/[id]': { allow: 'cases:read', records: { id: 'cases' } },
  'POST /api/cases/[id]/addendum': { allow: 'cases:work', records: { id: 'cases' } },
  'POST /api/cases/[id]/close': { allow: 'cases:work', records: { id: 'cases' } },
  'POST /api/cases/[id]/notes': { allow: 'cases:work', records: { id: 'cases' } },
  'POST /api/cases/[id]/readings': { allow: 'cases:work', records: { id: 'cases' } },
  'PUT /api/cases/[id]/symptoms': { allow: 'cases:work', records: { id: 'cases' } },
  'POST /api/cases/[id]/test-results': { allow: 'cases:work', records: { id: 'cases' } },
  'POST /api/cases/[id]/uploads': { allow: 'cases:work', records: { id: 'cases' }, body: 'multipart', maxBytes: MAX_UPLOAD_BYTES },
  'GET /api/cases/[id]/report': { allow: 'cases:read', records: { id: 'cases' } },
  'GET /api/cases/[id]/report.pdf': { allow: 'cases:read', records: { id: 'cases' } },
  'POST /api/cases/[id]/report/send': { allow: 'cases:work', records: { id: 'cases' }, limit: 'reportSend' },
  'PUT /api/cases/[id]/report/photos': { allow: 'cases:work', records: { id: 'cases' } },
  'POST /api/cases/[id]/readings/[index]/correction': { allow: 'cases:work', records: { id: 'cases', index: 'index' } },
  'POST /api/cases/[id]/outcomes/[index]/correction': { allow: 'cases:work', records: { id: 'cases', index: 'index' } },
  'POST /api/cases/[id]/steps': { allow: 'cases:work', records: { id: 'cases' } },
  'POST /api/cases/[id]/steps/[index]/strike': { allow: 'cases:work', records: { id: 'cases', index: 'index' } },
  'POST /api/emails/[id]/retry': { allow: 'cases:work', records: { id: 'emails' }, body: 'none', limit: 'reportSend' },
  'GET /api/people': { allow: 'cases:read' },
  'GET /api/cases/[id]/replay': { allow: 'training:run', records: { id: 'cases' } },

  // The equipment register.
  'GET /api/customers': { allow: 'equipment:read' },
  'POST /api/customers': { allow: 'equipment:edit' },
  'GET /api/customers/[id]': { allow: 'equipment:read', records: { id: 'customers' } },
  'PATCH /api/customers/[id]': { allow: 'equipment:edit', records: { id: 'customers' } },
  'GET /api/sites': { allow: 'equipment:read' },
  'POST /api/sites': { allow: 'equipment:edit' },
  'GET /api/sites/[id]': { allow: 'equipment:read', records: { id: 'sites' } },
  'PATCH /api/sites/[id]': { allow: 'equipment:edit', records: { id: 'sites' } },
  'POST /api/sites/[id]/contacts': { allow: 'equipment:edit', records: { id: 'sites' } },
  'PATCH /api/contacts/[id]': { allow: 'equipment:edit', records: { id: 'contacts' } },
  'DELETE /api/contacts/[id]': { allow: 'equipment:edit', records: { id: 'contacts' }, body: 'none' },
  'GET /api/units': { allow: 'equipment:read' },
  'POST /api/units': { allow: 'equipment:edit' },
  'GET /api/units/[id]': { allow: 'equipment:read', records: { id: 'units' } },
  'PATCH /api/units/[id]': { allow: 'equipment:edit', records: { id: 'units' } },
  'GET /api/units/[id]/overview': { allow: 'equipment:read', records: { id: 'units' } },
  'GET /api/units/[id]/uploads': { allow: 'equipment:read', records: { id: 'units' } },
  'GET /api/units/[id]/nameplate': { allow: 'equipment:read', records: { id: 'units' } },
  'POST /api/units/[id]/nameplate': { allow: 'equipment:edit', records: { id: 'units' } },
  'POST /api/units/[id]/uploads': { allow: ['equipment:edit', 'cases:work'], records: { id: 'units' }, body: 'multipart', maxBytes: MAX_UPLOAD_BYTES },
  'GET /api/equipment/units': { allow: 'equipment:read' },
  'GET /api/uploads/[id]': { allow: ['cases:read', 'equipment:read'], records: { id: 'uploads' } },

  // The refrigerant log, cylinders and compliance duties.
  'GET /api/units/[id]/refrigerant-log': { allow: 'equipment:read', records: { id: 'units' } },
  'POST /api/units/[id]/refrigerant-log': { allow: 'cases:work', records: { id: 'units' } },
  'POST /api/units/[id]/compliance-checks': { allow: 'cases:work', records: { id: 'units' } },
  'PUT /api/units/[id]/compliance-settings': { allow: 'equipment:edit', records: { id: 'units' } },
  'GET /api/compliance/settings': { allow: 'equipment:read' },
  'PUT /api/compliance/settings': { allow: 'compliance:configure' },
  'GET /api/compliance/due': { allow: 'equipment:read' },
  'GET /api/cylinders': { allow: 'equipment:read' },
  'POST /api/cylinders': { allow: 'cases:work' },
  'GET /api/cylinders/[id]': { allow: 'equipment:read', records: { id: 'cylinders' } },

  // Data-logger files on cases.
  'POST /api/cases/[id]/logger-files': { allow: 'cases:work', records: { id: 'cases' }, body: 'csv', maxBytes: MAX_LOGGER_BYTES },
  'GET /api/cases/[id]/logger-files': { allow: 'cases:read', records: { id: 'cases' } },
  'GET /api/logger-files/[id]': { allow: 'cases:read', records: { id: 'logger-files' } },
  'POST /api/logger-files/[id]/process': { allow: 'cases:work', records: { id: 'logger-files' } },
  'POST /api/logger-files/[id]/accept': { allow: 'cases:work', records: { id: 'logger-files' } },
  'GET /api/logger-mappings': { allow: 'cases:read' },

  // Diagnosis.
  'POST /api/diagnosis/rank': { allow: 'knowledge:read' },
  'GET /api/diagnosis/agreement': { allow: 'knowledge:read' },
  'GET /api/diagnosis/tests': { allow: 'knowledge:read' },
  'GET /api/diagnosis/titles': { allow: 'knowledge:read' },
  'GET /api/diagnosis/vocabulary': { allow: 'knowledge:read' },

  // Knowledge-base authoring.
  'GET /api/knowledge-base/versions': { allow: 'knowledge:author' },
  'GET /api/knowledge-base/versions/[id]': { allow: 'knowledge:author', records: { id: 'kb-versions' } },
  'GET /api/knowledge-base/versions/[id]/bundle': { allow: 'knowledge:author', records: { id: 'kb-versions' } },
  'POST /api/knowledge-base/versions/[id]/impact': { allow: 'knowledge:author', records: { id: 'kb-versions' }, body: 'none' },
  'POST /api/knowledge-base/bundles': { allow: 'knowledge:author', maxBytes: MAX_BUNDLE_BYTES },
  'POST /api/knowledge-base/versions': { allow: 'knowledge:author' },
  'POST /api/knowledge-base/findings/validate': { allow: 'knowledge:author' },
  'GET /api/knowledge-base/audit': { allow: 'knowledge:author' },
  'GET /api/knowledge-base/accuracy': { allow: 'knowledge:author' },
  'GET /api/knowledge-base/versions/[id]/content': { allow: 'knowledge:author', records: { id: 'kb-versions' } },
  'GET /api/knowledge-base/versions/[id]/diff': { allow: 'knowledge:author', records: { id: 'kb-versions' } },
  'POST /api/knowledge-base/versions/[id]/check': { allow: 'knowledge:author', records: { id: 'kb-versions' }, body: 'none' },
  'POST /api/knowledge-base/versions/[id]/submit': { allow: 'knowledge:author', records: { id: 'kb-versions' } },
  'POST /api/knowledge-base/versions/[id]/review': { allow: 'knowledge:author', records: { id: 'kb-versions' } },
  'POST /api/knowledge-base/versions/[id]/publish': { allow: 'knowledge:author', records: { id: 'kb-versions' }, body: 'none' },
  'PUT /api/knowledge-base/versions/[id]/causes/[key]': { allow: 'knowledge:author', records: { id: 'kb-versions', key: 'index' } },
  'PUT /api/knowledge-base/versions/[id]/tests/[key]': { allow: 'knowledge:author', records: { id: 'kb-versions', key: 'index' } },
  'POST /api/knowledge-base/versions/[id]/findings': { allow: 'knowledge:author', records: { id: 'kb-versions' } },
  'PUT /api/knowledge-base/versions/[id]/findings/[key]': { allow: 'knowledge:author', records: { id: 'kb-versions', key: 'index' } },
  'DELETE /api/knowledge-base/versions/[id]/findings/[key]': { allow: 'knowledge:author', records: { id: 'kb-versions', key: 'index' }, body: 'none' },

  // Training.
  'GET /api/exercises': { allow: 'cases:read' },
  'POST /api/exercises': { allow: 'training:run' },
  'GET /api/exercises/[id]': { allow: 'cases:read', records: { id: 'exercises' } },
  'PATCH /api/exercises/[id]': { allow: 'training:run', records: { id: 'exercises' } },
  'PUT /api/exercises/[id]/assignees': { allow: 'training:run', records: { id: 'exercises' } },
  'GET /api/exercises/[id]/attempts': { allow: 'cases:read', records: { id: 'exercises' } },
  'POST /api/exercises/[id]/attempts': { allow: 'cases:read', records: { id: 'exercises' }, body: 'none' },
  'GET /api/exercise-attempts': { allow: 'cases:read' },
  'GET /api/exercise-attempts/[id]': { allow: 'cases:read', records: { id: 'exercise-attempts' }, personal: true },
  'POST /api/exercise-attempts/[id]/requests': { allow: 'cases:read', records: { id: 'exercise-attempts' }, personal: true },
  'POST /api/exercise-attempts/[id]/answer': { allow: 'cases:read', records: { id: 'exercise-attempts' }, personal: true },
  'POST /api/training/accuracy': { allow: 'training:run', body: 'none' },

  // Background jobs and the mail outbox.
  'GET /api/jobs/[id]': { allow: 'signed-in', records: { id: 'jobs' } },
  'GET /api/outbox': { allow: 'outbox:read' },
  'GET /api/outbox/[id]': { allow: 'outbox:read', records: { id: 'outbox-message' } },
  'GET /api/outbox/[id]/attachments/[index]': { allow: 'outbox:read', records: { id: 'outbox-message', index: 'index' } },
} as const satisfies Record<string, RouteRule>

export type RouteKey = keyof typeof ROUTE_RULES

export const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

interface CompiledRule {
  key: string
  method: string
  pattern: RegExp
  params: string[]
  /** Lower is tried first: static segments before parameters, the catch-all last. */
  rank: number
  rule: RouteRule
}

/** Splits a key into its method and path. */
export function parseRouteKey(key: string): { method: string; path: string } {
  const [method, path] = key.split(' ') as [string, string]
  return { method, path }
}

function compile(key: string, rule: RouteRule): CompiledRule {
  const { method, path } = parseRouteKey(key)
  const params: string[] = []
  let rank = 0
  const source = path
    .split('/')
    .map((segment) => {
      if (segment === '[...]') {
        params.push('...')
        rank += 1000
        return '.*'
      }
      // A parameter may be the whole segment or part of it ('[id].pdf').
      return segment.replace(/\[(\w+)\]|([^[]+)/g, (_, name: string | undefined, text: string | undefined) => {
        if (name) {
          params.push(name)
          rank += 1
          return '([^/]+)'
        }
        return text!.replace(/[.*+?^${}()|\\]/g, '\\$&')
      })
    })
    .join('/')
  return { key, method, pattern: new RegExp(`^${source}/?$`), params, rank, rule }
}

const COMPILED: CompiledRule[] = Object.entries(ROUTE_RULES as Record<string, RouteRule>)
  .map(([key, rule]) => compile(key, rule))
  .sort((a, b) => a.rank - b.rank)

/** The rule of the route that serves `method` `path` (no query string), with the path's parameters; null when none does. */
export function matchRouteRule(method: string, path: string): { key: string; rule: RouteRule; params: Record<string, string> } | null {
  const wanted = method === 'HEAD' ? 'GET' : method
  for (const compiled of COMPILED) {
    if (compiled.method !== '*' && compiled.method !== wanted) continue
    const match = compiled.pattern.exec(path)
    if (!match) continue
    let params: Record<string, string>
    try {
      params = Object.fromEntries(compiled.params.map((name, i) => [name, decodeURIComponent(match[i + 1] ?? '')]))
    } catch {
      params = {}
    }
    return { key: compiled.key, rule: compiled.rule, params }
  }
  return null
}

/** The permissions a rule asks for (empty for public and signed-in routes). */
export function rulePermissions(rule: RouteRule): Permission[] {
  if (rule.allow === 'public' || rule.allow === 'signed-in') return []
  return typeof rule.allow === 'string' ? [rule.allow] : [...rule.allow]
}
