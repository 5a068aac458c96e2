// Every API route file has exactly one rule in server/utils/route-rules.ts, and the rule says what
// its handler asks for; the matcher picks the route Nitro would serve.
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { ROUTE_RULES, matchRouteRule, rulePermissions, type RouteRule } from '#server/utils/route-rules'
import { routeFiles } from '../../../route-files'

const ROOT = new URL('../../../..', import.meta.url).pathname
const RULES = ROUTE_RULES as Record<string, RouteRule>

describe('route rules', () => {
  const files = routeFiles(ROOT)

  it('cover every route file', () => {
    const missing = files.filter((f) => !RULES[f.key]).map((f) =>
      `${f.file} has no rule: add a line '${f.key}': { allow: … } to ROUTE_RULES in server/utils/route-rules.ts (who may call it, and the record kind of each [param])`)
    expect(missing).toEqual([])
  })

  it('name only routes that exist (or that a module provides)', () => {
    const keys = new Set(files.map((f) => f.key))
    const stale = Object.entries(RULES).filter(([key, rule]) => !rule.providedBy && !keys.has(key)).map(([key]) => key)
    expect(stale).toEqual([])
  })

  it('declare the record kind of every path parameter', () => {
    const undeclared = Object.entries(RULES).flatMap(([key, rule]) =>
      [...key.matchAll(/\[(\w+|\.\.\.)\]/g)].map((m) => m[1]!).filter((p) => !rule.records?.[p]).map((p) => `${key}: [${p}]`))
    expect(undeclared).toEqual([])
  })

  it('ask for the same permission the handler asks for', () => {
    const differing = files.flatMap((f) => {
      const rule = RULES[f.key]
      if (!rule) return []
      const source = readFileSync(join(ROOT, f.file), 'utf8')
      const call = /requireUser\(event(?:,\s*(\[[^\]]*\]|'[^']*'))?\)/.exec(source)
      if (/export \{ default \} from/.test(source)) return []
      if (!call) return rule.allow === 'public' ? [] : [`${f.key}: the rule asks for ${String(rule.allow)} but the handler calls no requireUser`]
      const asked = call[1] ? [...call[1].matchAll(/'([^']+)'/g)].map((m) => m[1]) : []
      const ruled = rulePermissions(rule)
      if (rule.allow === 'public') return [`${f.key}: public in the rules, but the handler requires a user`]
      return JSON.stringify([...asked].sort()) === JSON.stringify([...ruled].sort()) ? [] : [`${f.key}: rule ${JSON.stringify(ruled)}, handler ${JSON.stringify(asked)}`]
    })
    expect(differing).toEqual([])
  })
})

describe('matchRouteRule', () => {
  it('prefers a fixed segment to a parameter, and reads the parameters', () => {
    expect(matchRouteRule('GET', '/api/cases/12')).toMatchObject({ key: 'GET /api/cases/[id]', params: { id: '12' } })
    expect(matchRouteRule('GET', '/api/cases/12/report.pdf')?.key).toBe('GET /api/cases/[id]/report.pdf')
    expect(matchRouteRule('GET', '/api/cases/12/report')?.key).toBe('GET /api/cases/[id]/report')
    expect(matchRouteRule('GET', '/api/cases')?.key).toBe('GET /api/cases')
    expect(matchRouteRule('HEAD', '/api/units/3/overview')?.key).toBe('GET /api/units/[id]/overview')
    expect(matchRouteRule('GET', '/api/outbox/a.eml/attachments/2')).toMatchObject({ params: { id: 'a.eml', index: '2' } })
  })

  it('sends a method or path without a route to the catch-all', () => {
    expect(matchRouteRule('DELETE', '/api/cases/12')?.key).toBe('* /api/[...]')
    expect(matchRouteRule('GET', '/api/nothing/here')?.key).toBe('* /api/[...]')
  })
})
