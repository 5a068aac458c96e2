import { describe, expect, it } from 'vitest'
import { runExample, runExamples } from '#server/domain/knowledge/examples'
import { seedKb } from '../diagnosis/scenario-helpers'

describe('worked examples of a finding', () => {
  const kb = seedKb()

  it('passes when the finding applies as expected and moves causes the expected way', () => {
    const outcome = runExample(kb, 'cabinet-against-target', {
      title: 'Cabinet at its target', stage: 'low', facts: { cabinetAboveTargetK: 0.5 }, expect: 'fires',
      moves: [{ cause: 'no-refrigeration-fault', direction: 'up' }, { cause: 'refrigerant-leak', direction: 'down' }],
    })
    expect(outcome).toMatchObject({ passed: true, problems: [] })
  })

  it('fails when a fact the finding reads is missing, naming it', () => {
    const outcome = runExample(kb, 'cabinet-against-target', { title: 'No cabinet reading', facts: {}, expect: 'fires' })
    expect(outcome.passed).toBe(false)
    expect(outcome.problems.join()).toMatch(/lacks cabinetAboveTargetK/)
  })

  it('checks "does not fire" against the conditions of the stage copy named', () => {
    const facts = { 'low.running': true, 'low.evaporatingResidualK': 20, cabinetVsEvaporatingK: 15, cabinetVsEvaporatingUncertaintyK: 1 }
    expect(runExample(kb, 'cabinet-warm-with-stage-at-design', { title: 'Suction far off design', stage: 'low', facts, expect: 'does-not-fire' }).passed).toBe(true)
    const atDesign = { ...facts, 'low.evaporatingResidualK': 0 }
    const failed = runExample(kb, 'cabinet-warm-with-stage-at-design', { title: 'Suction at design', stage: 'low', facts: atDesign, expect: 'does-not-fire' })
    expect(failed).toMatchObject({ passed: false, problems: ['applies, but the example says it should not'] })
  })

  it('fails a move in the wrong direction and says which way it went', () => {
    const outcome = runExample(kb, 'cabinet-against-target', {
      title: 'At target', stage: 'low', facts: { cabinetAboveTargetK: 0 }, expect: 'fires', moves: [{ cause: 'refrigerant-leak', direction: 'up' }],
    })
    expect(outcome.passed).toBe(false)
    expect(outcome.problems.join()).toMatch(/moves refrigerant-leak down .* expected up/)
  })

  it('asks for the stage of a finding written for several, and reports unknown findings', () => {
    const results = runExamples(kb, {
      'cabinet-against-evaporating': [{ title: 'No stage', facts: {}, expect: 'fires' }],
      'no-such-finding': [{ title: 'Ghost', facts: {}, expect: 'fires' }],
    })
    expect(results.map((r) => r.passed)).toEqual([false, false])
    expect(results[0]!.problems.join()).toMatch(/say which stage/)
    expect(results[1]!.problems.join()).toMatch(/no finding is named/)
  })
})
