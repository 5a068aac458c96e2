// The app's pages as the files under app/pages define them, for the checks that open every one.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'

/** Route patterns of every page file, e.g. '/cases/[id]/logger', '/units/new', '/'. */
export function pageRoutes(root: string): string[] {
  const pages = join(root, 'app/pages')
  const walk = (dir: string): string[] =>
    readdirSync(dir).flatMap((name) => {
      const full = join(dir, name)
      return statSync(full).isDirectory() ? walk(full) : /\.vue$/.test(name) ? [full] : []
    })
  return walk(pages)
    .map((full) => `/${relative(pages, full).replace(/\.vue$/, '')}`.replace(/\/index$/, '') || '/')
    .sort()
}

/** True when the pattern has a part filled at run time ('[id]', '[...slug]'). */
export function isDynamic(pattern: string): boolean {
  return pattern.includes('[')
}
