import { JOBS } from '#server/jobs'
import { startJobWorkers, type JobDefinition } from '#server/services/jobs'

// Starts this process's background workers (report e-mails and later kinds) once the server is up,
// and stops them gracefully on shutdown. A database that is not reachable yet is retried.
export default defineNitroPlugin((nitro) => {
  let stop: (() => Promise<void>) | undefined
  let closing = false
  const start = async (delayMs: number) => {
    if (closing) return
    try {
      stop = await startJobWorkers(JOBS as readonly JobDefinition[])
    } catch (error) {
      console.error('[jobs] workers did not start:', error instanceof Error ? error.message : error)
      setTimeout(() => void start(Math.min(delayMs * 2, 60_000)), delayMs).unref()
    }
  }
  void start(1_000)
  nitro.hooks.hook('close', async () => {
    closing = true
    await stop?.()
  })
})
