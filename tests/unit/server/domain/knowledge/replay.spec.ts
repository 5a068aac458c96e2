import { describe, expect, it } from 'vitest'
import { orderCauses, rankDiagnosis } from '#server/domain/diagnosis/rank'
import { HELD_OUT_SCENARIOS, TUNING_SCENARIOS } from '#server/domain/diagnosis/scenarios/suite'
import { seedKb } from '../diagnosis/scenario-helpers'

describe('ordering causes only, for replays of many cases', () => {
  it('gives exactly the order and probabilities of the full ranking, for every version asked', async () => {
    const kb = seedKb()
    const copy = { ...structuredClone({ causes: kb.causes, tests: kb.tests, rules: kb.rules }), version: { id: 'copy', label: 'copy', status: 'draft' as const } }
    for (const scenario of [...TUNING_SCENARIOS.slice(0, 30), ...HELD_OUT_SCENARIOS.slice(0, 10)]) {
      const options = { equipmentClass: scenario.equipmentClass }
      const full = (await rankDiagnosis(kb, scenario.request, options)).causes.map((c) => ({ cause: c.cause, stage: c.stage, probability: c.probability }))
      // Twice: the second time the kept starting odds are used.
      for (let round = 0; round < 2; round++) {
        const [mine, theirs] = await orderCauses([kb, copy], scenario.request, options)
        expect(mine!.map((c) => ({ cause: c.cause, stage: c.stage, probability: c.probability })), scenario.id).toEqual(full)
        expect(theirs!.map((c) => ({ cause: c.cause, stage: c.stage, probability: c.probability })), scenario.id).toEqual(full)
      }
    }
  })

  it('keeps starting odds apart for units whose records rule different causes out', async () => {
    const kb = seedKb()
    const scenario = TUNING_SCENARIOS.find((s) => s.request.unit.kind === 'single-stage')!
    const withValve = { ...scenario.request, unit: { ...scenario.request.unit, stages: scenario.request.unit.stages.map((s) => ({ ...s, meteringDevice: 'expansion-valve' as const })) } }
    const capillary = { ...scenario.request, unit: { ...scenario.request.unit, stages: scenario.request.unit.stages.map((s) => ({ ...s, meteringDevice: 'capillary' as const })) } }
    const [valveOrder] = await orderCauses([kb], withValve)
    const [capillaryOrder] = await orderCauses([kb], capillary)
    expect(valveOrder!.some((c) => c.cause === 'expansion-valve-underfeeding')).toBe(true)
    expect(capillaryOrder!.some((c) => c.cause === 'expansion-valve-underfeeding')).toBe(false)
    expect((await rankDiagnosis(kb, capillary)).causes.map((c) => c.cause)).toEqual(capillaryOrder!.map((c) => c.cause))
  })
})
