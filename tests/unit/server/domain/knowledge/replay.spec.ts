import { describe, expect, it } from 'vitest'
import { rankCauses, rankDiagnosis } from '#server/domain/diagnosis/rank'
import { TUNING_SCENARIOS } from '#server/domain/diagnosis/scenarios/suite'
import { seedKb } from '../diagnosis/scenario-helpers'

describe('ranking causes only, for replays of many cases', () => {
  it('gives exactly the causes of the full ranking, for every version asked', async () => {
    const kb = seedKb()
    const copy = { ...structuredClone({ causes: kb.causes, tests: kb.tests, rules: kb.rules }), version: { id: 'copy', label: 'copy', status: 'draft' as const } }
    for (const scenario of TUNING_SCENARIOS.slice(0, 20)) {
      const options = { equipmentClass: scenario.equipmentClass }
      const full = await rankDiagnosis(kb, scenario.request, options)
      const [mine, theirs] = await rankCauses([kb, copy], scenario.request, options)
      expect(mine, scenario.id).toEqual(full.causes)
      expect(theirs, scenario.id).toEqual(full.causes)
    }
  })
})
