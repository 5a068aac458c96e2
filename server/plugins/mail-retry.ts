// Retries report e-mails that failed or are still pending, every 30 seconds.
export default defineNitroPlugin((nitro) => {
  const timer = setInterval(() => void deliverDueEmails(), 30_000)
  timer.unref()
  nitro.hooks.hook('close', () => clearInterval(timer))
})
