import { diagnosisVocabulary } from '#server/services/diagnosis'
import type { DiagnosisVocabularyDto } from '#shared/types/diagnosis-catalogue'

// The words the rank request and the rules use, with the measurement units each quantity accepts.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:read')
  return (await diagnosisVocabulary(actor)) satisfies DiagnosisVocabularyDto
})
