import { publishedAccuracy } from '#server/services/knowledge'
import type { PublishedAccuracyDto } from '#shared/types/knowledge'

// The published version's accuracy as last measured (null when not measured since it was published).
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  return (await publishedAccuracy(actor)) satisfies PublishedAccuracyDto | null
})
