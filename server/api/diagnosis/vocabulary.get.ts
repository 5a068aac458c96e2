import { FACT_SPECS } from '#server/domain/diagnosis/fact-vocabulary'
import { CAUSES, DIMENSION_UNITS, QUANTITY_DIMENSION, STAGES, SYMPTOMS, TESTS, UNIT_KINDS, UNIT_WIDE_QUANTITIES, STAGE_QUANTITIES } from '#shared/types/diagnosis'

// The words the rank request and the rules use, with the units each quantity accepts.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'knowledge:read')
  const kb = await publishedKnowledgeBase(user.organisationId)
  const titles = new Map(kb.causes.map((c) => [c.slug, c.title]))
  const quantity = (q: (typeof STAGE_QUANTITIES)[number] | (typeof UNIT_WIDE_QUANTITIES)[number], perStage: boolean) => ({
    quantity: q, perStage, dimension: QUANTITY_DIMENSION[q], units: DIMENSION_UNITS[QUANTITY_DIMENSION[q]],
  })
  return {
    unitKinds: UNIT_KINDS,
    stages: STAGES,
    quantities: [...STAGE_QUANTITIES.map((q) => quantity(q, true)), ...UNIT_WIDE_QUANTITIES.map((q) => quantity(q, false))],
    symptoms: SYMPTOMS,
    causes: CAUSES.map((c) => ({ cause: c, title: titles.get(c) ?? c })),
    tests: TESTS,
    units: { pressure: DIMENSION_UNITS.pressure, temperature: DIMENSION_UNITS.temperature, current: DIMENSION_UNITS.current, time: DIMENSION_UNITS.time, bool: DIMENSION_UNITS.bool },
    facts: [...FACT_SPECS.values()].map((f) => ({ name: f.name, type: f.type, unit: f.unit, meaning: f.meaning })),
  }
})
