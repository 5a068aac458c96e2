import { describe, expect, it } from 'vitest'
import { cacheSizes, createCache } from '#server/utils/cache'

describe('caches', () => {
  it('load a key once even when asked for it many times at once', async () => {
    const cache = createCache<{ n: number }>('test: shared loads', { max: 10 })
    let loads = 0
    const loader = async () => {
      loads++
      await new Promise((resolve) => setTimeout(resolve, 10))
      return { n: loads }
    }
    const values = await Promise.all([cache.load('k', loader), cache.load('k', loader), cache.load('k', loader)])
    expect(values.map((v) => v.n)).toEqual([1, 1, 1])
    expect(await cache.load('k', loader)).toEqual({ n: 1 })
    expect(loads).toBe(1)
  })

  it('keep nothing from a failed load, and stay within their bound', async () => {
    const cache = createCache<{ v: string }>('test: bounded', { max: 2 })
    await expect(cache.load('bad', () => Promise.reject(new Error('database down')))).rejects.toThrow('database down')
    expect(cache.get('bad')).toBeUndefined()
    for (const key of ['a', 'b', 'c']) cache.set(key, { v: key })
    expect(cache.size).toBe(2)
    expect(cache.get('a')).toBeUndefined()
    expect(cacheSizes()).toContainEqual({ name: 'test: bounded', size: 2 })
  })
})
