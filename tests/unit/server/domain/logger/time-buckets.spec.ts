import { describe, expect, it } from 'vitest'
import { TimeBuckets } from '#server/domain/logger/time-buckets'

describe('TimeBuckets', () => {
  it('keeps every value while the series fits, then merges neighbours and doubles the width', () => {
    const b = new TimeBuckets(4, 1, 1000)
    for (let s = 0; s < 4; s++) b.add(s * 1000, [s])
    expect(b.points(0).map((p) => p.mean)).toEqual([0, 1, 2, 3])
    b.add(4000, [10])
    expect(b.width).toBe(2000)
    expect(b.points(0)).toEqual([
      { t: 0, min: 0, max: 1, mean: 0.5 },
      { t: 2000, min: 2, max: 3, mean: 2.5 },
      { t: 4000, min: 10, max: 10, mean: 10 },
    ])
  })

  it('holds a million rows in the same memory and keeps a one-row spike in the max', () => {
    const b = new TimeBuckets(1024, 2)
    for (let i = 0; i < 1_000_000; i++) b.add(i * 1000, [i === 500_000 ? 50 : -80, i % 2 ? null : 1])
    const pts = b.points(0)
    expect(pts.length).toBeLessThanOrEqual(1024)
    expect(Math.max(...pts.map((p) => p.max))).toBe(50)
    expect(Math.min(...pts.map((p) => p.min))).toBe(-80)
    expect(b.points(1).every((p) => p.mean === 1)).toBe(true) // missing values are skipped, not zeros
  })

  it('leaves empty buckets out across a gap', () => {
    const b = new TimeBuckets(8, 1, 1000)
    b.add(0, [1])
    b.add(5000, [2])
    expect(b.points(0).map((p) => p.t)).toEqual([0, 5000])
    expect(b.mean(2, 0)).toBeNull()
  })
})
