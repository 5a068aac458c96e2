/**
 * Fixed-memory downsampling of several time series that arrive together, in time order, without
 * knowing their length: each row's values fall into equal time buckets (min, max, sum, count per
 * series); when the log outgrows the buckets, neighbours merge and the bucket width doubles. A
 * million rows or ten keep the same few kilobytes, and a spike survives in its bucket's max, which a
 * plain average would hide. All series share one time axis, so bucket i means the same moment in each.
 */
import type { SeriesPoint } from '#shared/types/logger'

/** Downsampled series with a shared, doubling time axis; see the module header. */
export class TimeBuckets {
  private readonly min: Float64Array
  private readonly max: Float64Array
  private readonly sum: Float64Array
  private readonly count: Uint32Array
  private origin: number | null = null
  private used = 0
  /** Bucket width, ms. */
  width: number

  constructor(
    readonly capacity: number,
    readonly seriesCount: number,
    initialWidthMs = 1000,
  ) {
    if (!Number.isInteger(capacity) || capacity < 2 || capacity % 2) throw new RangeError('capacity must be an even integer of at least 2')
    this.width = initialWidthMs
    const size = capacity * seriesCount
    this.min = new Float64Array(size)
    this.max = new Float64Array(size)
    this.sum = new Float64Array(size)
    this.count = new Uint32Array(size)
  }

  /** Adds one row at time `t` (ms); times must not decrease; null values are skipped. */
  add(t: number, values: readonly (number | null)[]): void {
    if (this.origin === null) this.origin = t
    let i = Math.floor((t - this.origin) / this.width)
    while (i >= this.capacity) {
      this.halve()
      i = Math.floor((t - this.origin) / this.width)
    }
    const n = this.seriesCount
    for (let s = 0; s < n; s++) {
      const v = values[s]
      if (v === null || v === undefined) continue
      const k = i * n + s
      if (this.count[k] === 0) {
        this.min[k] = v
        this.max[k] = v
      } else {
        if (v < this.min[k]!) this.min[k] = v
        if (v > this.max[k]!) this.max[k] = v
      }
      this.sum[k] = this.sum[k]! + v
      this.count[k] = this.count[k]! + 1
    }
    if (i + 1 > this.used) this.used = i + 1
  }

  private halve(): void {
    const n = this.seriesCount
    const half = this.capacity / 2
    for (let b = 0; b < half; b++) {
      for (let s = 0; s < n; s++) {
        const a = 2 * b * n + s
        const c = a + n
        const k = b * n + s
        const ca = this.count[a]!
        const cc = this.count[c]!
        this.min[k] = ca && cc ? Math.min(this.min[a]!, this.min[c]!) : ca ? this.min[a]! : this.min[c]!
        this.max[k] = ca && cc ? Math.max(this.max[a]!, this.max[c]!) : ca ? this.max[a]! : this.max[c]!
        this.sum[k] = this.sum[a]! + this.sum[c]!
        this.count[k] = ca + cc
      }
    }
    const from = half * n
    this.min.fill(0, from)
    this.max.fill(0, from)
    this.sum.fill(0, from)
    this.count.fill(0, from)
    this.used = Math.ceil(this.used / 2)
    this.width *= 2
  }

  /** Number of buckets in use (some may be empty). */
  get length(): number {
    return this.used
  }

  /** Start time (ms) of bucket i. */
  timeOf(i: number): number {
    return (this.origin ?? 0) + i * this.width
  }

  /** Mean of series s in bucket i, or null when the bucket holds no value of it. */
  mean(i: number, s: number): number | null {
    const k = i * this.seriesCount + s
    return this.count[k] ? this.sum[k]! / this.count[k]! : null
  }

  /** The buckets of series s that hold data, in time order, each stamped with its start time. */
  points(s: number): SeriesPoint[] {
    const out: SeriesPoint[] = []
    const n = this.seriesCount
    for (let i = 0; i < this.used; i++) {
      const k = i * n + s
      const c = this.count[k]!
      if (c) out.push({ t: this.timeOf(i), min: this.min[k]!, max: this.max[k]!, mean: this.sum[k]! / c })
    }
    return out
  }
}
