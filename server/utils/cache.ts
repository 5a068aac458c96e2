// In-process caches, all built here on lru-cache. Several app processes (one per core, and maybe
// several machines) share one database, so a cache never relies on being told about a change:
// its keys carry the version of what they hold (a knowledge-base version id, or a generation from
// the organisation's cache stamps, see server/db/repositories/cache-stamps.ts). When the data
// changes, the key changes, and the old entry simply ages out.
import { LRUCache } from 'lru-cache'

/** A bounded cache of values by string key. */
export interface Cache<V extends object> {
  readonly name: string
  /** The cached value, if any. */
  get(key: string): V | undefined
  /** Stores a value. */
  set(key: string, value: V): void
  /** The cached value, or the loader's result (stored); concurrent loads of one key share one call. */
  load(key: string, loader: () => Promise<V>): Promise<V>
  /** Forgets one key. */
  delete(key: string): void
  /** Forgets everything. */
  clear(): void
  /** How many entries it holds now. */
  readonly size: number
}

const caches: Cache<object>[] = []

/** Creates a named cache holding at most `max` entries, each for at most `ttlMs` when given. */
export function createCache<V extends object>(name: string, options: { max: number; ttlMs?: number }): Cache<V> {
  const lru = new LRUCache<string, V, () => Promise<V>>({
    max: options.max,
    ...(options.ttlMs ? { ttl: options.ttlMs } : {}),
    fetchMethod: (_key, _stale, { context }) => context(),
  })
  const cache: Cache<V> = {
    name,
    get: (key) => lru.get(key),
    set: (key, value) => void lru.set(key, value),
    load: async (key, loader) => (await lru.fetch(key, { context: loader }))!,
    delete: (key) => void lru.delete(key),
    clear: () => lru.clear(),
    get size() {
      return lru.size
    },
  }
  caches.push(cache as Cache<object>)
  return cache
}

/** Every cache of this process with its size, for diagnostics and benchmarks. */
export function cacheSizes(): { name: string; size: number }[] {
  return caches.map((c) => ({ name: c.name, size: c.size }))
}
