/**
 * The scenario suite: fault signatures from published tables and trade practice, built with
 * physically consistent readings, must rank the cause they were built from first in at least 90 % of
 * cases and in the first two always, on the tuning part and on the held-out part, whether or not the
 * organisation has a history of confirmed causes.
 */
import { describe, expect, it } from 'vitest'
import { demoHistoryCounts } from '#server/db/seeders/demo-cases'
import { rankDiagnosis } from '#server/domain/diagnosis/rank'
import { seedKb } from './scenario-helpers'
import { HELD_OUT_SCENARIOS, TUNING_SCENARIOS, hypothesisLabel, scoreSuite } from '#server/domain/diagnosis/scenarios/suite'

const ALL = [...TUNING_SCENARIOS, ...HELD_OUT_SCENARIOS]
const history = demoHistoryCounts()

describe('scenario suite', () => {
  it('has at least 80 scenarios, each naming its source, with unique ids', () => {
    expect(ALL.length).toBeGreaterThanOrEqual(80)
    expect(new Set(ALL.map((s) => s.id)).size).toBe(ALL.length)
    for (const s of ALL) expect(s.source, s.id).toMatch(/\b(19|20)\d\d\b|common practice, no source/)
  })

  it('covers single-stage and cascade units, the refrigerants of the trade, pressure units, altitude, noise, partial readings, two symptoms and healthy systems', () => {
    const refrigerants = new Set(ALL.flatMap((s) => s.request.unit.stages.map((st) => st.refrigerant)))
    for (const r of ['R1150', 'R170', 'R23', 'R508B', 'R404A', 'R290', 'R134a', 'R744']) expect(refrigerants, r).toContain(r)
    const units = new Set(ALL.flatMap((s) => (s.request.readings ?? []).map((r) => r.unit)))
    for (const u of ['psig', 'kPa', 'bar', 'barg', 'MPa', 'kPag', 'F']) expect(units, u).toContain(u)
    expect(ALL.some((s) => (s.request.site?.altitudeM ?? 0) > 1000)).toBe(true)
    expect(ALL.some((s) => (s.request.readings ?? []).length <= 4)).toBe(true)
    expect(ALL.some((s) => (s.request.symptoms ?? []).length >= 2)).toBe(true)
    expect(ALL.filter((s) => s.expected.cause === 'no-refrigeration-fault').length).toBeGreaterThanOrEqual(5)
    expect(new Set(ALL.map((s) => s.request.unit.kind))).toEqual(new Set(['cascade', 'single-stage']))
  })

  for (const [part, scenarios] of [['tuning', TUNING_SCENARIOS], ['held-out', HELD_OUT_SCENARIOS]] as const) {
    for (const [regime, byClass] of [['no history', undefined], ['the demo organisation’s history', (c: string) => history.get(c) ?? []]] as const) {
      it(`${part} part, ${regime}: top-1 ≥ 90 %, top-2 100 %`, async () => {
        const score = await scoreSuite(seedKb(), scenarios, byClass)
        const misses = score.results.filter((r) => r.rank !== 1).map((r) => `${r.scenario.id} ${hypothesisLabel(r.scenario.expected)} ranked ${r.rank}: ${r.ranked.slice(0, 3).join(', ')}`)
        expect(score.top1 / score.total, misses.join('\n')).toBeGreaterThanOrEqual(0.9)
        expect(score.top2, misses.join('\n')).toBe(score.total)
      })
    }
  }

  it('gives the same first cause with or without the demo history', async () => {
    const plain = await scoreSuite(seedKb(), ALL)
    const learned = await scoreSuite(seedKb(), ALL, (c) => history.get(c) ?? [])
    expect(learned.results.map((r) => r.ranked[0])).toEqual(plain.results.map((r) => r.ranked[0]))
  })

  it('speaks in people’s words: no fact names, unfilled placeholders or missing values in evidence, warnings or notes', async () => {
    const rough: string[] = []
    for (const s of ALL) {
      const r = await rankDiagnosis(seedKb(), s.request)
      const texts = [...r.causes.flatMap((c) => [...c.evidence, ...c.evidenceAgainst].map((e) => e.text)), ...r.warnings, ...r.setAside, r.priorNote, ...r.tests.map((t) => t.value)]
      for (const t of texts) if (/\?|undefined|NaN|[{}]|\b[a-z]+\.[a-z]+[A-Z]\w*|\b(high|low|single):[a-z]/.test(t)) rough.push(`${s.id}: ${t}`)
    }
    expect(rough).toEqual([])
  })
})
