// Starts another instance of the built app on the test database with settings of its own (a site
// address, a switch), for checks that depend on how the server was started.
import { spawn, type ChildProcess } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { createServer } from 'node:net'

const ROOT = new URL('../..', import.meta.url).pathname

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer()
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number }
      server.close(() => resolve(port))
    })
    server.on('error', reject)
  })
}

export interface AppProcess {
  baseUrl: string
  child: ChildProcess
  stop(): Promise<void>
}

/**
 * The built server on a free loopback port with `env` added; resolves once /api/health answers
 * with `readyStatus` (503 for a server started on a database that is down).
 */
export async function startApp(env: Record<string, string> = {}, readyStatus = 200): Promise<AppProcess> {
  const port = await freePort()
  const child = spawn(process.execPath, ['.output/server/index.mjs'], {
    cwd: ROOT,
    env: {
      ...process.env, HOST: '127.0.0.1', PORT: String(port), NUXT_DATABASE_URL: process.env.DATABASE_URL!,
      NUXT_SESSION_PASSWORD: randomBytes(32).toString('hex'), NITRO_CLUSTER_WORKERS: '1', ...env,
    },
    stdio: ['ignore', 'ignore', 'inherit'],
    detached: true,
  })
  const baseUrl = `http://127.0.0.1:${port}`
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return
    const exited = new Promise((r) => child.once('exit', r))
    try {
      process.kill(-child.pid!, 'SIGTERM')
    } catch {
      return
    }
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))])
    if (child.exitCode === null && child.signalCode === null) process.kill(-child.pid!, 'SIGKILL')
  }
  for (let i = 0; i < 150; i++) {
    try {
      if ((await fetch(`${baseUrl}/api/health`)).status === readyStatus) return { baseUrl, child, stop }
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200))
  }
  await stop()
  throw new Error('the app did not start')
}
