#!/usr/bin/env node
// `npm run bench`: prints Rimecase's speed figures. In-process benchmarks of the property module, the
// diagnosis engine and the data-logger CSV analysis, then HTTP and browser figures and the load
// figures (mixed technician workload, 5-minute soak with the server's memory, the case list at 100
// rows a page) against a throwaway stack on loopback.
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

// RIMECASE_BENCH_ONLY=impact runs only the impact replay, =load only the load figures (mixed
// workload, soak, case list), each on its throwaway stack.
const impactOnly = process.env.RIMECASE_BENCH_ONLY === 'impact'
const loadOnly = process.env.RIMECASE_BENCH_ONLY === 'load'
ensureNodeModules()
const chromium = ensureChromium()
if (!impactOnly && !loadOnly) {
  step('Refrigerant properties (in-process)')
  await run(bin('tsx'), ['--tsconfig', 'tsconfig.scripts.json', 'scripts/bench-properties.ts'])
  step('Diagnosis engine (in-process)')
  await run(bin('tsx'), ['--tsconfig', 'tsconfig.scripts.json', 'scripts/bench-diagnosis.ts'])
  step('Data-logger CSV, 50 MB / 1 million rows, streaming (in-process)')
  await run(bin('tsx'), ['--tsconfig', 'tsconfig.scripts.json', 'scripts/bench-logger.ts'])
}
step('HTTP and browser (throwaway stack on loopback)')
const db = await startDatabase('rimecase-bench-')
let server
try {
  buildIfStale()
  server = await startServer(db)
  if (!impactOnly && !loadOnly) await run(process.execPath, ['scripts/bench-http.mjs'], { RIMECASE_BENCH_BASE_URL: server.baseUrl, CHROMIUM_PATH: chromium })
  if (!impactOnly) {
    // A fresh server for the load figures, so the soak starts from its memory at rest.
    await server.stop()
    server = await startServer(db)
    step('Load: mixed technician workload, soak, case list (throwaway stack on loopback)')
    await run(process.execPath, ['scripts/bench-load.mjs'], { RIMECASE_BENCH_BASE_URL: server.baseUrl })
  }
  if (!loadOnly) {
    // Last: it adds a generated history of closed cases to the demo organisation.
    step('Impact of a draft on 10,000 generated past cases: the job POST /api/knowledge-base/versions/{id}/impact starts')
    await run(bin('tsx'), ['--tsconfig', 'tsconfig.scripts.json', 'scripts/bench-impact.ts'], { RIMECASE_BENCH_BASE_URL: server.baseUrl, DATABASE_URL: db.databaseUrl })
  }
} finally {
  await server?.stop()
  db.stop()
}
