// The diagnostic tests of the published knowledge base with their outcomes and cautions.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'knowledge:read')
  const kb = await publishedKnowledgeBase(user.organisationId)
  return kb.tests.map((t) => ({
    test: t.slug,
    title: t.title,
    minutes: t.minutes,
    opensSystem: t.opensSystem,
    hotWork: t.hotWork,
    stages: t.stages,
    safetyNotes: t.safetyNotes,
    procedure: t.procedure,
    outcomes: t.outcomes.map((o) => ({ outcome: o.slug, label: o.label })),
  }))
})
