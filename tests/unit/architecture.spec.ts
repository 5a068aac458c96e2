// The layering the code relies on, checked on the source tree itself: routes are thin and go
// through the one error mapper, plain modules import no framework, and nothing imports in a circle.
import { readFileSync, readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import madge from 'madge'
import { describe, expect, it } from 'vitest'

const ROOT = new URL('../..', import.meta.url).pathname

function filesUnder(dir: string, ext = /\.ts$/): string[] {
  return readdirSync(join(ROOT, dir)).flatMap((name) => {
    const path = join(dir, name)
    return statSync(join(ROOT, path)).isDirectory() ? filesUnder(path, ext) : ext.test(name) ? [path] : []
  })
}
const source = (path: string) => readFileSync(join(ROOT, path), 'utf8')
const CATCH_ALL = 'server/api/[...].ts'

describe('API routes', () => {
  const routes = filesUnder('server/api').filter((f) => f !== CATCH_ALL)

  it('are defined with defineApiHandler, so the one error mapper decides every status', () => {
    const plain = routes.filter((f) => !/defineApiHandler\(|export \{ default \} from/.test(source(f)))
    expect(plain).toEqual([])
  })

  it('stay short: authorize, validate, call a service, return', () => {
    const lines = routes.map((f) => ({ f, n: source(f).trimEnd().split('\n').length })).sort((a, b) => a.n - b.n)
    expect(lines.at(-1)!.n, lines.at(-1)!.f).toBeLessThanOrEqual(16)
    expect(lines[Math.floor(lines.length / 2)]!.n).toBeLessThanOrEqual(12)
  })

  it('query nothing themselves: no repository, model or Sequelize import', () => {
    const reaching = routes.filter((f) => /#server\/db\/|from 'sequelize'/.test(source(f)))
    expect(reaching).toEqual([])
  })
})

describe('errors', () => {
  it('become HTTP errors only in the mapper (and the catch-all of unknown API paths)', () => {
    const allowed = new Set(['server/utils/errors.ts', CATCH_ALL])
    const creating = filesUnder('server').filter((f) => !allowed.has(f) && /\bcreateError\(/.test(source(f)))
    expect(creating).toEqual([])
  })
})

describe('plain modules', () => {
  it('in server/domain and shared import no framework', () => {
    const framework = /from '(h3|nitropack[^']*|#imports|vue|sequelize|pinia|nuxt[^']*)'/
    const offending = [...filesUnder('server/domain'), ...filesUnder('shared')].filter((f) => framework.test(source(f)))
    expect(offending).toEqual([])
  })
})

describe('imports', () => {
  it('form no circle in server/ and shared/', async () => {
    const graph = await madge([join(ROOT, 'server'), join(ROOT, 'shared')], {
      fileExtensions: ['ts'], tsConfig: join(ROOT, 'tsconfig.scripts.json'), baseDir: ROOT,
    })
    expect(graph.circular().map((cycle) => cycle.map((f) => relative(ROOT, join(ROOT, f))).join(' > '))).toEqual([])
  }, 60_000)
})

describe('browser tests', () => {
  it('all take `test` from tests/e2e/helpers.ts, which fails a test on any Content Security Policy violation', () => {
    const specs = filesUnder('tests/e2e').filter((f) => f.endsWith('.spec.ts'))
    expect(specs.length).toBeGreaterThan(0)
    const own = specs.filter((f) => /import \{[^}]*\btest\b[^}]*\} from '@playwright\/test'/.test(source(f)) || !/import \{[^}]*\btest\b[^}]*\} from '\.\/helpers'/.test(source(f)))
    expect(own).toEqual([])
  })
})

