// Generated logger series with known shapes (invented demo data, not measurements).
import { Readable } from 'node:stream'

export const MIN = 60_000

/** A cabinet temperature at minute m: falls from `fromC` towards `toC` at `rateKPerHour`, flat while stalled. */
export interface Shape {
  fromC: number
  toC: number
  rateKPerHour: number
  /** A plateau: the cabinet stops at `levelC` from minute `atMinute` for `minutes`. */
  stall?: { levelC: number; minutes: number }
}

/** Minute-by-minute cabinet temperatures of a pull-down with an optional stall (held flat, ±0.2 K ripple). */
export function pullDownSeries(shape: Shape, totalMinutes: number): number[] {
  const out: number[] = []
  let c = shape.fromC
  let stalledFor = 0
  for (let m = 0; m < totalMinutes; m++) {
    const ripple = 0.2 * Math.sin(m / 3)
    if (shape.stall && c <= shape.stall.levelC && stalledFor < shape.stall.minutes) {
      stalledFor++
      out.push(shape.stall.levelC + ripple)
      continue
    }
    c = Math.max(shape.toC, c - shape.rateKPerHour / 60)
    out.push(c + (c === shape.toC ? ripple : 0))
  }
  return out
}

const pad = (n: number) => String(n).padStart(2, '0')
/** "2025-03-01 08:00:00" for minute m after 08:00 on 1 March 2025 (UTC). */
export function isoTime(m: number, start = Date.UTC(2025, 2, 1, 8, 0, 0)): string {
  const d = new Date(start + m * MIN)
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())} ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}:${pad(d.getUTCSeconds())}`
}
/** "01.03.2025 08:00" style. */
export function dmyTime(m: number, start = Date.UTC(2025, 2, 1, 8, 0, 0)): string {
  const d = new Date(start + m * MIN)
  return `${pad(d.getUTCDate())}.${pad(d.getUTCMonth() + 1)}.${d.getUTCFullYear()} ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}`
}

export const stream = (text: string | Buffer) => Readable.from([typeof text === 'string' ? Buffer.from(text, 'utf8') : text])
/** A stream cut into small chunks, as a slow upload would arrive (tests chunk boundaries). */
export const chunked = (text: string, size: number) => {
  const buf = Buffer.from(text, 'utf8')
  const parts: Buffer[] = []
  for (let i = 0; i < buf.length; i += size) parts.push(buf.subarray(i, i + size))
  return Readable.from(parts)
}
