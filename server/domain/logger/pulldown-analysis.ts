/**
 * How a cabinet behaved over a logged period, read from an evenly spaced series (the analysis buckets):
 * pull-downs (from warm towards the setpoint: rate, time to setpoint), stalls (a plateau above the
 * setpoint while the compressor runs), warm-ups after the setpoint was reached, and the symptoms this
 * suggests for a case, each with the numbers behind it.
 *
 * Thresholds are trade rules of thumb (common practice, no source) and can be set per mapping:
 * at setpoint within 3 K; a pull-down starts at least 10 K above that; a plateau stays within 1.5 K for
 * 45 min or more and lies 5 K or more above the setpoint; an average pull-down of 20 K per hour is
 * expected unless the mapping says how many hours the unit should take.
 */
import type { OfferedSymptom, PullDown, Stall, WarmUp } from '#shared/types/logger'

export interface AnalysisSeries {
  /** Bucket start times, ms. */
  t: readonly number[]
  cabinetC: readonly (number | null)[]
  /** Share of the bucket the compressor ran (0–1), when a running column is mapped. */
  running: readonly (number | null)[] | null
  ambientC: readonly (number | null)[] | null
  cascadeHxC: readonly (number | null)[] | null
}

export interface AnalysisSettings {
  setpointC: number | null
  setpointToleranceK?: number
  stallBandK?: number
  stallMinMinutes?: number
  expectedPullDownHours?: number
}

export interface PullDownReport {
  pullDowns: PullDown[]
  stalls: Stall[]
  warmUps: WarmUp[]
  symptoms: OfferedSymptom[]
  notes: string[]
}

/** The analysis thresholds used when the mapping sets none (K, minutes, K per hour). */
export const DEFAULTS = { setpointToleranceK: 3, stallBandK: 1.5, stallMinMinutes: 45, pullDownStartK: 10, stallAboveK: 5, warmUpK: 5, expectedRateKPerHour: 20, minDropK: 5 }

const MIN = 60_000
const HOUR = 3_600_000
const f1 = (x: number) => x.toFixed(1).replace('-', '\u2212')
const f0 = (x: number) => x.toFixed(0).replace('-', '\u2212')

interface Point {
  t: number
  c: number
  run: number | null
  amb: number | null
  hx: number | null
}

function compact(s: AnalysisSeries): Point[] {
  const out: Point[] = []
  for (let i = 0; i < s.t.length; i++) {
    const c = s.cabinetC[i]
    if (c === null || c === undefined) continue
    out.push({ t: s.t[i]!, c, run: s.running?.[i] ?? null, amb: s.ambientC?.[i] ?? null, hx: s.cascadeHxC?.[i] ?? null })
  }
  return out
}

function meanOf(values: (number | null)[]): number | null {
  const v = values.filter((x): x is number => x !== null)
  return v.length ? v.reduce((a, b) => a + b, 0) / v.length : null
}

/** Rate of fall, K/h (positive when cooling), over the first hour after `from` (up to `to`). */
function initialRate(points: Point[], from: number, to: number): number | null {
  let b = from
  while (b + 1 <= to && points[b + 1]!.t - points[from]!.t <= HOUR) b++
  const dt = points[b]!.t - points[from]!.t
  return dt > 0 ? ((points[from]!.c - points[b]!.c) / dt) * HOUR : null
}

/** Rate of fall, K/h, over the last hour before `to` (back to `from`). */
function finalRate(points: Point[], from: number, to: number): number | null {
  let a = to
  while (a - 1 >= from && points[to]!.t - points[a - 1]!.t <= HOUR) a--
  const dt = points[to]!.t - points[a]!.t
  return dt > 0 ? ((points[a]!.c - points[to]!.c) / dt) * HOUR : null
}

/** Where a descent from `peak` levels out: the first point within 1 K of the lowest after it. */
function bottomOfDescent(points: Point[], peak: number): number {
  let lowest = points[peak]!.c
  for (let i = peak; i < points.length; i++) lowest = Math.min(lowest, points[i]!.c)
  for (let i = peak; i < points.length; i++) if (points[i]!.c <= lowest + 1) return i
  return peak
}

function findPullDowns(points: Point[], setpoint: number | null, tol: number): { pd: PullDown; from: number; to: number }[] {
  const out: { pd: PullDown; from: number; to: number }[] = []
  const make = (from: number, to: number, reached: boolean) => {
    const p0 = points[from]!
    const p1 = points[to]!
    const hours = (p1.t - p0.t) / HOUR
    out.push({
      from,
      to,
      pd: {
        startAt: p0.t,
        startC: p0.c,
        reached,
        reachedAt: reached ? p1.t : null,
        minutesToSetpoint: reached ? (p1.t - p0.t) / MIN : null,
        endAt: p1.t,
        endC: p1.c,
        averageRateKPerHour: hours > 0 ? (p0.c - p1.c) / hours : 0,
        initialRateKPerHour: initialRate(points, from, to),
        finalRateKPerHour: finalRate(points, from, to),
      },
    })
  }
  if (setpoint === null) {
    // Without a setpoint only the main descent can be told: from the warmest point to the coldest after it.
    let peak = 0
    for (let i = 1; i < points.length; i++) if (points[i]!.c > points[peak]!.c) peak = i
    const low = bottomOfDescent(points, peak)
    if (points[peak]!.c - points[low]!.c >= DEFAULTS.minDropK) make(peak, low, false)
    return out
  }
  const atSetpoint = setpoint + tol
  const startAbove = atSetpoint + DEFAULTS.pullDownStartK
  let peak = -1
  for (let i = 0; i < points.length; i++) {
    const c = points[i]!.c
    if (peak < 0) {
      if (c > startAbove) peak = i
      continue
    }
    if (c >= points[peak]!.c) peak = i
    else if (c <= atSetpoint) {
      make(peak, i, true)
      peak = -1
    }
  }
  if (peak >= 0) {
    const low = bottomOfDescent(points, peak)
    if (points[peak]!.c - points[low]!.c >= DEFAULTS.minDropK) make(peak, low, false)
  }
  return out
}

/** Maximal stretches where the cabinet stays within `band` K for at least `minMs`. */
function plateaus(points: Point[], band: number, minMs: number): [number, number][] {
  const out: [number, number][] = []
  let i = 0
  while (i < points.length) {
    let lo = points[i]!.c
    let hi = lo
    let j = i + 1
    while (j < points.length) {
      const c = points[j]!.c
      const nlo = Math.min(lo, c)
      const nhi = Math.max(hi, c)
      if (nhi - nlo > band) break
      lo = nlo
      hi = nhi
      j++
    }
    if (points[j - 1]!.t - points[i]!.t >= minMs) {
      out.push([i, j - 1])
      i = j
    } else i++
  }
  return out
}

function findStalls(points: Point[], setpoint: number, tol: number, band: number, minMs: number): { stalls: Stall[]; atAmbient: Stall[] } {
  const stalls: Stall[] = []
  const atAmbient: Stall[] = []
  for (const [a, b] of plateaus(points, band, minMs)) {
    const seg = points.slice(a, b + 1)
    const level = meanOf(seg.map((p) => p.c))!
    if (level < setpoint + tol + DEFAULTS.stallAboveK) continue
    const run = meanOf(seg.map((p) => p.run))
    if (run !== null && run < 0.8) continue // a plateau with the compressor mostly off is an idle unit, not a stall
    const amb = meanOf(seg.map((p) => p.amb))
    const stall: Stall = {
      startAt: seg[0]!.t,
      endAt: seg[seg.length - 1]!.t,
      minutes: (seg[seg.length - 1]!.t - seg[0]!.t) / MIN,
      levelC: level,
      aboveSetpointK: level - setpoint,
      running: run === null ? null : true,
      cascadeHxC: meanOf(seg.map((p) => p.hx)),
      ambientC: amb,
    }
    if (amb !== null && Math.abs(level - amb) <= 3) atAmbient.push(stall)
    else stalls.push(stall)
  }
  return { stalls, atAmbient }
}

function findWarmUps(points: Point[], setpoint: number, tol: number): WarmUp[] {
  const out: WarmUp[] = []
  const atSetpoint = setpoint + tol
  const warm = atSetpoint + DEFAULTS.warmUpK
  let lastCold = -1
  let open: { start: number; peak: number; crossed: boolean } | null = null
  for (let i = 0; i < points.length; i++) {
    const c = points[i]!.c
    if (c <= atSetpoint) {
      if (open?.crossed) out.push(warmUp(points, open.start, open.peak, i))
      open = null
      lastCold = i
      continue
    }
    if (lastCold < 0) continue
    if (!open) open = { start: lastCold, peak: i, crossed: false }
    if (c > points[open.peak]!.c) open.peak = i
    if (c > warm) open.crossed = true
  }
  if (open?.crossed) out.push(warmUp(points, open.start, open.peak, null))
  return out
}

function warmUp(points: Point[], start: number, peak: number, end: number | null): WarmUp {
  const last = end ?? points.length - 1
  const run = meanOf(points.slice(start, last + 1).map((p) => p.run))
  return {
    startAt: points[start]!.t,
    peakAt: points[peak]!.t,
    peakC: points[peak]!.c,
    endAt: end === null ? null : points[end]!.t,
    minutes: (points[last]!.t - points[start]!.t) / MIN,
    compressorOff: run === null ? null : run < 0.5,
  }
}

function dailyTrend(points: Point[]): { slopeKPerDay: number; riseK: number; days: number } | null {
  if (!points.length) return null
  const t0 = points[0]!.t
  const days = Math.floor((points[points.length - 1]!.t - t0) / (24 * HOUR))
  if (days < 2) return null
  const minima: number[] = new Array(days).fill(Infinity)
  for (const p of points) {
    const d = Math.floor((p.t - t0) / (24 * HOUR))
    if (d < days && p.c < minima[d]!) minima[d] = p.c
  }
  const xs = minima.map((_, i) => i)
  const xm = (days - 1) / 2
  const ym = minima.reduce((a, b) => a + b, 0) / days
  const slope = xs.reduce((s, x, i) => s + (x - xm) * (minima[i]! - ym), 0) / xs.reduce((s, x) => s + (x - xm) ** 2, 0)
  return { slopeKPerDay: slope, riseK: minima[days - 1]! - minima[0]!, days }
}

/** Pull-downs, stalls, warm-ups and the symptoms they suggest. */
export function analysePullDown(series: AnalysisSeries, settings: AnalysisSettings): PullDownReport {
  const tol = settings.setpointToleranceK ?? DEFAULTS.setpointToleranceK
  const band = settings.stallBandK ?? DEFAULTS.stallBandK
  const minMs = (settings.stallMinMinutes ?? DEFAULTS.stallMinMinutes) * MIN
  const points = compact(series)
  const notes: string[] = []
  const symptoms: OfferedSymptom[] = []
  if (points.length < 3) return { pullDowns: [], stalls: [], warmUps: [], symptoms, notes: ['Too few cabinet temperatures to analyse.'] }
  const sp = settings.setpointC
  const found = findPullDowns(points, sp, tol)
  const pullDowns = found.map((f) => f.pd)
  if (sp === null) {
    notes.push('No setpoint known: give it in the mapping to get the time to setpoint, stalls and warm-ups.')
    return { pullDowns, stalls: [], warmUps: [], symptoms, notes }
  }
  if (series.running === null) notes.push('No compressor column: stalls assume the compressor was running.')
  const { stalls, atAmbient } = findStalls(points, sp, tol, band, minMs)
  const warmUps = findWarmUps(points, sp, tol)

  for (const pd of pullDowns) {
    const needK = pd.startC - (sp + tol)
    const expectedH = settings.expectedPullDownHours ?? Math.max(1, needK / DEFAULTS.expectedRateKPerHour)
    const hours = pd.reached ? pd.minutesToSetpoint! / 60 : (points[points.length - 1]!.t - pd.startAt) / HOUR
    const from = `from ${f1(pd.startC)} °C`
    if (pd.reached && hours > expectedH * 1.25) {
      symptoms.push({ symptom: 'slow-pulldown', evidence: `Pull-down ${from} took ${f1(hours)} h to reach ${f1(sp + tol)} °C (setpoint ${f1(sp)} °C); about ${f1(expectedH)} h expected. Average ${f1(pd.averageRateKPerHour)} K/h.` })
    } else if (!pd.reached && hours > expectedH) {
      symptoms.push({ symptom: 'slow-pulldown', evidence: `Pull-down ${from} had not reached the setpoint (${f1(sp)} °C) after ${f1(hours)} h; lowest ${f1(pd.endC)} °C. About ${f1(expectedH)} h expected.` })
    }
  }
  for (const s of stalls) {
    const hx = s.cascadeHxC !== null ? ` Cascade heat exchanger ${f1(s.cascadeHxC)} °C meanwhile.` : ''
    const run = s.running ? ' with the compressor running' : ''
    const text = `Cabinet stalled at ${f1(s.levelC)} °C, ${f0(s.aboveSetpointK)} K above the setpoint, for ${f0(s.minutes)} min${run}.${hx}`
    symptoms.push({ symptom: s.aboveSetpointK >= 20 ? 'not-cooling' : 'slow-pulldown', evidence: text })
  }
  for (const s of atAmbient) {
    symptoms.push({ symptom: 'not-cooling', evidence: `Cabinet stayed at ${f1(s.levelC)} °C, within 3 K of the room (${f1(s.ambientC!)} °C), for ${f0(s.minutes)} min${s.running ? ' while the compressor ran' : ''}.` })
  }
  const lowest = Math.min(...points.map((p) => p.c))
  const span = points[points.length - 1]!.t - points[0]!.t
  if (!pullDowns.some((p) => p.reached) && lowest > sp + 15 && span >= 2 * HOUR && !symptoms.some((s) => s.symptom === 'not-cooling')) {
    symptoms.push({ symptom: 'not-cooling', evidence: `Over ${f1(span / HOUR)} h the cabinet never got below ${f1(lowest)} °C, ${f0(lowest - sp)} K above the setpoint.` })
  }
  if (warmUps.length >= 2) {
    const worst = warmUps.reduce((a, b) => (b.peakC > a.peakC ? b : a))
    const longest = Math.max(...warmUps.map((w) => w.minutes))
    const off = warmUps.filter((w) => w.compressorOff).length
    symptoms.push({
      symptom: 'intermittent-cooling',
      evidence: `After reaching the setpoint the cabinet warmed ${warmUps.length} times, up to ${f1(worst.peakC)} °C (longest ${f0(longest)} min)${off ? `; the compressor was off during ${off} of them` : ''}.`,
    })
  }
  const unrecovered = warmUps.at(-1)
  if (unrecovered && unrecovered.endAt === null && unrecovered.peakC >= sp + tol + DEFAULTS.pullDownStartK && unrecovered.minutes >= 60) {
    const how = `After reaching the setpoint the cabinet warmed to ${f1(unrecovered.peakC)} °C and had not recovered ${f0(unrecovered.minutes)} min later, at the end of the log`
    if (unrecovered.compressorOff === true) symptoms.push({ symptom: 'compressor-not-starting', evidence: `${how}, with the compressor off.` })
    else symptoms.push({ symptom: 'not-cooling', evidence: `${how}${unrecovered.compressorOff === false ? ', with the compressor running' : ''}.` })
  }
  const trend = dailyTrend(points)
  if (trend && trend.slopeKPerDay >= 0.5 && trend.riseK >= 1.5) {
    symptoms.push({ symptom: 'warming-over-days', evidence: `The daily lowest cabinet temperature rose ${f1(trend.riseK)} K over ${trend.days} days (${f1(trend.slopeKPerDay)} K per day).` })
  }
  return { pullDowns, stalls, warmUps, symptoms, notes }
}
