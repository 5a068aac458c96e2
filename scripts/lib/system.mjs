// Machine set-up shared by `npm start` and `npm test`. Uses only Node built-ins, because it runs
// before `npm ci` may have installed anything.
import { execFileSync, spawn, spawnSync } from 'node:child_process'
import { existsSync, readdirSync, statSync } from 'node:fs'
import { createServer } from 'node:net'
import { join } from 'node:path'

export const ROOT = new URL('../..', import.meta.url).pathname.replace(/\/$/, '')
export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0

/** Prints a step in the same shape everywhere. */
export function step(message) {
  console.log(`\x1b[36m▸\x1b[0m ${message}`)
}

/** Runs a command in the project root, inheriting output (unless `options.stdio` says otherwise); throws when it fails. Returns its stdout when piped. */
export function run(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { cwd: ROOT, stdio: 'inherit', ...options })
  if (result.status !== 0) {
    if (result.stdout) process.stdout.write(result.stdout)
    throw new Error(`${cmd} ${args.join(' ')} exited with ${result.status ?? result.signal}`)
  }
  return result.stdout
}

/** Runs `npm ci` when node_modules is missing or older than the lock file. */
export function ensureNodeModules() {
  const marker = join(ROOT, 'node_modules', '.package-lock.json')
  const lock = join(ROOT, 'package-lock.json')
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return
  step('Installing npm packages (npm ci)')
  run('npm', ['ci', '--no-audit', '--no-fund'])
}

function aptInstall(packages, why) {
  if (!isRoot()) {
    console.error(`${why} is not installed. Run as root:\n  apt-get update && apt-get install -y ${packages.join(' ')}`)
    process.exit(1)
  }
  step(`Installing ${packages.join(', ')} from Debian (apt-get)`)
  run('apt-get', ['update'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } })
  run('apt-get', ['install', '-y', '--no-install-recommends', ...packages], {
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  })
}

/** Finds the newest Debian PostgreSQL server binaries, installing the server when absent. */
export function ensurePostgresBinaries() {
  const find = () => {
    const base = '/usr/lib/postgresql'
    if (!existsSync(base)) return null
    const versions = readdirSync(base)
      .filter((v) => existsSync(join(base, v, 'bin', 'initdb')) && existsSync(join(base, v, 'bin', 'pg_ctl')))
      .sort((a, b) => Number(b) - Number(a))
    return versions.length ? join(base, versions[0], 'bin') : null
  }
  let bin = find()
  if (!bin) {
    aptInstall(['postgresql'], 'PostgreSQL')
    bin = find()
  }
  if (!bin) throw new Error('PostgreSQL binaries not found under /usr/lib/postgresql/*/bin after installing')
  return bin
}

/** Returns the path of Debian's Chromium, installing it when absent. */
export function ensureChromium() {
  const path = '/usr/bin/chromium'
  if (!existsSync(path)) aptInstall(['chromium'], 'Chromium')
  return path
}

/** Asks the kernel for a free TCP port on loopback. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = createServer()
    server.once('error', reject)
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address()
      server.close(() => resolve(port))
    })
  })
}

/** True when something already listens on 127.0.0.1:port. */
export function portInUse(port) {
  return new Promise((resolve) => {
    const server = createServer()
    server.once('error', () => resolve(true))
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(false)))
  })
}

/**
 * Starts a long-running child in its own process group; its output is prefixed so the console
 * stays readable. The server runs one worker process per core, so stopping means signalling the
 * whole group: `stopChild` does that and waits for the main process to exit.
 */
export function startChild(name, cmd, args, env) {
  const child = spawn(cmd, args, { cwd: ROOT, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'], detached: true })
  const prefix = (chunk) => chunk.toString().split('\n').filter(Boolean).map((l) => `[${name}] ${l}`).join('\n')
  child.stdout.on('data', (c) => console.log(prefix(c)))
  child.stderr.on('data', (c) => console.error(prefix(c)))
  // If this script dies without cleaning up, do not leave the group running.
  process.once('exit', () => signalGroup(child, 'SIGKILL'))
  return child
}

function signalGroup(child, signal) {
  try {
    process.kill(-child.pid, signal)
  } catch {
    // already gone
  }
}

/** Stops a child started by startChild (SIGTERM to its group, SIGKILL after `graceMs`). */
export function stopChild(child, graceMs = 10_000) {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve()
    const force = setTimeout(() => signalGroup(child, 'SIGKILL'), graceMs)
    child.once('exit', () => {
      clearTimeout(force)
      signalGroup(child, 'SIGKILL')
      resolve()
    })
    signalGroup(child, 'SIGTERM')
  })
}

/** Polls an HTTP URL until it answers (any status) or the timeout passes. */
export async function waitForHttp(url, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs
  while (Date.now() < until) {
    try {
      const res = await fetch(url)
      await res.arrayBuffer()
      return
    } catch {
      await new Promise((r) => setTimeout(r, 250))
    }
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`)
}

export function whoCanEnter(user, path) {
  return spawnSync('runuser', ['-u', user, '--', 'test', '-x', path]).status === 0
}

export function execQuiet(cmd, args, options = {}) {
  return execFileSync(cmd, args, { cwd: ROOT, encoding: 'utf8', ...options })
}
