import { join } from 'node:path'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { rankDiagnosis } from '#server/domain/diagnosis/rank'
import { TUNING_SCENARIOS, HELD_OUT_SCENARIOS, scoreSuite } from '../tests/unit/server/domain/diagnosis/scenarios/suite'
const kb = { ...loadKnowledgeBaseFromDirectory(join(process.cwd(), 'content-src')), version: { id: 's', label: 's', status: 'draft' as const } }
const which = process.argv[2] ?? 'tuning'
const only = process.argv[3]
;(async () => {
  const set = which === 'held' ? HELD_OUT_SCENARIOS : TUNING_SCENARIOS
  const s = await scoreSuite(kb, set)
  for (const r of s.results) {
    if (only && r.scenario.id !== only) continue
    const ok = r.rank === 1 ? 'ok ' : r.rank === 2 ? 'two' : 'BAD'
    if (r.rank !== 1 || only) console.log(ok, r.scenario.id, r.scenario.title, '| want', r.scenario.expected.cause, r.scenario.expected.stage ?? '', '| got', r.ranked.slice(0, 3).join(', '), 'rank', r.rank)
    if (only) {
      const resp = await rankDiagnosis(kb, r.scenario.request, { equipmentClass: r.scenario.equipmentClass })
      console.log(JSON.stringify(r.scenario.request.readings))
      for (const c of resp.causes.slice(0, 5)) { console.log(` ${(c.probability*100).toFixed(1)}% ${c.cause}@${c.stage ?? ''}`); for (const e of c.evidence) console.log('    +', e.rule, e.text); for (const e of c.evidenceAgainst) console.log('    -', e.rule, e.text) }
      console.log(resp.warnings, resp.derived)
    }
  }
  console.log(`${which}: top1 ${s.top1}/${s.total}  top2 ${s.top2}/${s.total}`)
})()
