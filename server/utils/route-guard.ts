import type { H3Event } from 'h3'
import { recordInOrganisation } from '#server/db/repositories/ownership'
import { spend } from '#server/services/rate-limits'
import { ForbiddenError, NotFoundError, TooLargeError, UnsupportedTypeError } from '#server/domain/errors'
import {
  MAX_JSON_BYTES, RECORD_TABLES, WRITE_METHODS, matchRouteRule, rulePermissions, type RecordKind, type RouteRule,
} from './route-rules'

const CATCH_ALL = '* /api/[...]'
const MAX_INT = 2_147_483_647
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

const NOT_FOUND_WORDS: Partial<Record<RecordKind, string>> = {
  cases: 'Case not found', units: 'Unit not found', sites: 'Site not found', customers: 'Customer not found',
  contacts: 'Contact not found', uploads: 'Upload not found', emails: 'E-mail not found', users: 'User not found', jobs: 'Job not found',
  'kb-versions': 'Knowledge-base version not found', exercises: 'Exercise not found', 'exercise-attempts': 'Attempt not found',
  cylinders: 'Cylinder not found', 'logger-files': 'Logger file not found',
}
/** Types a data-logger CSV arrives with (spreadsheet programs and browsers differ). */
const CSV_TYPES = new Set(['text/csv', 'text/plain', 'application/octet-stream', 'application/vnd.ms-excel', 'text/comma-separated-values'])
const WANTED_TYPE: Record<string, string> = {
  multipart: 'Send the file as multipart/form-data',
  csv: 'Send the CSV file itself as the request body (Content-Type: text/csv)',
  json: 'Send the request as JSON (Content-Type: application/json)',
}

/**
 * Applies the route's rule (server/utils/route-rules.ts) before its handler runs: a write from a
 * page of another origin is refused (403), a body of another type than the route takes (415) or
 * larger than its limit (413) is refused before it is read, the caller must be signed in with the
 * permission the rule names (401/403), and every record the path names must belong to the caller's
 * organisation (404); a rate-limited route counts the call (429 beyond the limit). A path no rule covers is a 404, even when a handler exists for it.
 */
export async function enforceRouteRule(event: H3Event): Promise<void> {
  const path = event.path.split('?')[0]!
  const matched = matchRouteRule(event.method, path)
  if (!matched || matched.key === CATCH_ALL) throw new NotFoundError(`No API route ${event.method} ${path}`)
  const { rule, params } = matched
  if (WRITE_METHODS.has(event.method)) {
    assertSameOrigin(event)
    await assertBody(event, rule)
  }
  if (rule.allow === 'public') return
  const actor = await requireUser(event, rulePermissions(rule))
  for (const [name, kind] of Object.entries(rule.records ?? {})) {
    if (!(kind in RECORD_TABLES)) continue
    const tableKind = kind as keyof typeof RECORD_TABLES
    const value = params[name] ?? ''
    const notFound = new NotFoundError(NOT_FOUND_WORDS[kind] ?? 'Not found')
    if (RECORD_TABLES[tableKind].id === 'integer') {
      // Not a whole number at all: the handler's schema answers 400 with the field's words.
      if (!/^\d+$/.test(value) || Number(value) === 0) continue
      if (value.length > 10 || Number(value) > MAX_INT) throw notFound
      if (!(await recordInOrganisation(tableKind, Number(value), actor.organisationId))) throw notFound
    } else {
      if (!UUID.test(value)) throw notFound
      if (!(await recordInOrganisation(tableKind, value, actor.organisationId))) throw notFound
    }
  }
  if (rule.limit) await spend(rule.limit, `${actor.id}`)
}

/** The origins this site is served from: the request's own host, and the configured site URL. */
function ownOrigins(event: H3Event): string[] {
  const host = getRequestHeader(event, 'host')
  const siteUrl = String(useRuntimeConfig().siteUrl || '')
  const origins: string[] = []
  if (host) origins.push(`http://${host}`, `https://${host}`)
  if (siteUrl) {
    try {
      origins.push(new URL(siteUrl).origin)
    } catch {
      // A malformed setting adds nothing.
    }
  }
  return origins
}

/** A write sent by a page of another origin (a form posted from elsewhere) is refused. */
function assertSameOrigin(event: H3Event): void {
  const origin = getRequestHeader(event, 'origin')
  if (origin !== undefined) {
    if (!ownOrigins(event).includes(origin.toLowerCase())) throw new ForbiddenError('Requests from other sites are refused')
    return
  }
  // Browsers that send no Origin still say where a request comes from.
  const site = getRequestHeader(event, 'sec-fetch-site')
  if (site === 'cross-site' || site === 'same-site') throw new ForbiddenError('Requests from other sites are refused')
}

/** Checks the body's declared type and size before anything reads it. */
async function assertBody(event: H3Event, rule: RouteRule): Promise<void> {
  const kind = rule.body ?? 'json'
  const limit = rule.maxBytes ?? MAX_JSON_BYTES
  const headers = event.node.req.headers
  const type = String(headers['content-type'] ?? '').split(';')[0]!.trim().toLowerCase()
  const length = Number.parseInt(String(headers['content-length'] ?? ''), 10)
  const chunked = /\bchunked\b/i.test(String(headers['transfer-encoding'] ?? ''))
  const hasBody = (Number.isFinite(length) && length > 0) || chunked
  if (type || hasBody) {
    const accepted = kind === 'multipart' ? type === 'multipart/form-data' : kind === 'csv' ? CSV_TYPES.has(type) : type === 'application/json'
    if (!accepted) throw new UnsupportedTypeError(WANTED_TYPE[kind] ?? WANTED_TYPE.json!)
  }
  const tooLarge = () => new TooLargeError(`The request is larger than ${Math.round(limit / 1024 / 1024)} MB`)
  if (Number.isFinite(length) && length > limit) {
    // A client sending the whole body before it reads the answer would see its connection reset
    // (EPIPE) rather than the 413 if the socket closed under it: up to a bounded excess the rest is
    // read and dropped and the connection stays usable; past that it is closed after the answer.
    if (length - limit > DISCARD_AT_MOST) setResponseHeader(event, 'connection', 'close')
    else event.node.req.resume()
    throw tooLarge()
  }
  if (chunked && !Number.isFinite(length)) {
    // No declared length: read it here with the limit, and hand the bytes to the body readers.
    // Past the limit the rest is read and dropped rather than left unread, so that the client,
    // still sending, receives the 413 instead of a reset connection.
    const bytes = await readAtMost(event, limit)
    if (!bytes) throw tooLarge()
    ;(event.node.req as unknown as Record<symbol, unknown>)[Symbol.for('h3RawBody')] = Promise.resolve(bytes)
  }
}

/** Bytes past the limit that are read and dropped before the connection is cut. */
const DISCARD_AT_MOST = 16 * 1024 * 1024

/** The request body, or null as soon as it passes `limit` bytes (the rest is then drained and dropped). */
function readAtMost(event: H3Event, limit: number): Promise<Buffer | null> {
  const req = event.node.req
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    const onData = (chunk: Buffer) => {
      size += chunk.length
      if (size > limit) {
        req.off('data', onData)
        chunks.length = 0
        let dropped = 0
        req.on('data', (more: Buffer) => {
          dropped += more.length
          if (dropped > DISCARD_AT_MOST) req.destroy()
        })
        resolve(null)
        return
      }
      chunks.push(chunk)
    }
    req.on('data', onData)
    req.once('end', () => resolve(Buffer.concat(chunks)))
    req.once('error', reject)
  })
}
