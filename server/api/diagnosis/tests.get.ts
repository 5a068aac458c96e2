import { diagnosticTests } from '#server/services/diagnosis'
import type { DiagnosticTestDto } from '#shared/types/diagnosis-catalogue'

// The diagnostic tests of the published knowledge base with their outcomes and cautions.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:read')
  return (await diagnosticTests(actor)) satisfies DiagnosticTestDto[]
})
