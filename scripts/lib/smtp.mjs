// A local stand-in for a mail relay: an SMTP server on 127.0.0.1 that stores every message it
// accepts as an .eml file in the outbox folder, where the admin Outbox page reads it.
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { ROOT, step } from './system.mjs'

/** Starts the SMTP fake; port 0 picks a free one. Resolves with { port, dir, close }. */
export async function startSmtpFake({ port = 0, dir = join(ROOT, '.data', 'outbox') } = {}) {
  const { SMTPServer } = await import('smtp-server')
  mkdirSync(dir, { recursive: true })
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 25 * 1024 * 1024,
    // Addresses under the reserved .invalid top-level domain (RFC 2606) can never exist: refuse
    // them as a real relay would, so failed deliveries and their retries can be tried out.
    onRcptTo(address, session, callback) {
      if (/\.invalid$/i.test(address.address)) return callback(Object.assign(new Error('No such mailbox'), { responseCode: 550 }))
      callback()
    },
    onData(stream, session, callback) {
      const chunks = []
      stream.on('data', (c) => chunks.push(c))
      stream.on('end', () => {
        const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}.eml`
        writeFileSync(join(dir, name), Buffer.concat(chunks))
        callback()
      })
    },
  })
  await new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(port, '127.0.0.1', resolve)
  })
  const actualPort = server.server.address().port
  step(`SMTP fake listening on 127.0.0.1:${actualPort}, storing mail in ${dir}`)
  return { port: actualPort, dir, close: () => new Promise((resolve) => server.close(resolve)) }
}
