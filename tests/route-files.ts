// The API routes as the files under server/api define them, for the tests that check each one.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'

export interface RouteFile {
  file: string
  /** 'POST /api/cases/[id]/notes': the key of the route's rule in server/utils/route-rules.ts. */
  key: string
  method: string
  path: string
}

const METHODS = ['get', 'post', 'put', 'patch', 'delete', 'head', 'options']

/** Every route file under server/api of the repository at `root`, with its method and path. */
export function routeFiles(root: string): RouteFile[] {
  const walk = (dir: string): string[] =>
    readdirSync(dir).flatMap((name) => {
      const full = join(dir, name)
      return statSync(full).isDirectory() ? walk(full) : /\.ts$/.test(name) ? [full] : []
    })
  return walk(join(root, 'server/api')).sort().map((full) => {
    const file = relative(root, full)
    let rest = relative(join(root, 'server'), full).replace(/\.ts$/, '')
    let method = '*'
    const suffix = /\.(\w+)$/.exec(rest)
    if (suffix && METHODS.includes(suffix[1]!)) {
      method = suffix[1]!.toUpperCase()
      rest = rest.slice(0, -suffix[0].length)
    }
    const path = `/${rest}`.replace(/\/index$/, '')
    return { file, key: `${method} ${path}`, method, path }
  })
}
