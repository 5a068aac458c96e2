#!/usr/bin/env node
// `npm run bench`: prints Rimecase's speed figures. In-process benchmarks of the property module, the
// diagnosis engine and the data-logger CSV analysis, then HTTP and browser figures against a throwaway
// stack on loopback.
import { spawn } from 'node:child_process'
import { join } from 'node:path'
import { ROOT, ensureChromium, ensureNodeModules, step } from './lib/system.mjs'
import { buildIfStale } from './lib/project.mjs'
import { startDatabase, startServer } from './lib/harness.mjs'

const bin = (name) => join(ROOT, 'node_modules', '.bin', name)
function run(cmd, args, env = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { cwd: ROOT, stdio: 'inherit', env: { ...process.env, ...env } })
    child.once('exit', (code) => (code === 0 ? resolve() : reject(new Error(`${args.join(' ')} exited with ${code}`))))
  })
}

ensureNodeModules()
const chromium = ensureChromium()
step('Refrigerant properties (in-process)')
await run(bin('tsx'), ['--tsconfig', 'tsconfig.scripts.json', 'scripts/bench-properties.ts'])
step('Diagnosis engine (in-process)')
await run(bin('tsx'), ['--tsconfig', 'tsconfig.scripts.json', 'scripts/bench-diagnosis.ts'])
step('Data-logger CSV, 50 MB / 1 million rows, streaming (in-process)')
await run(bin('tsx'), ['--tsconfig', 'tsconfig.scripts.json', 'scripts/bench-logger.ts'])
step('HTTP and browser (throwaway stack on loopback)')
const db = await startDatabase('rimecase-bench-')
let server
try {
  buildIfStale()
  server = await startServer(db)
  await run(process.execPath, ['scripts/bench-http.mjs'], { RIMECASE_BENCH_BASE_URL: server.baseUrl, CHROMIUM_PATH: chromium })
} finally {
  await server?.stop()
  db.stop()
}
