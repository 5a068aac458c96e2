import { describe, expect, it } from 'vitest'
import { analysePullDown, type AnalysisSeries } from '#server/domain/logger/pulldown-analysis'
import { MIN, pullDownSeries } from './fixtures'

const T0 = Date.UTC(2025, 2, 1, 8)
function series(cabinet: number[], extra: Partial<AnalysisSeries> = {}): AnalysisSeries {
  return { t: cabinet.map((_, m) => T0 + m * MIN), cabinetC: cabinet, running: null, ambientC: null, cascadeHxC: null, ...extra }
}

// Generated ULT pull-down (invented): +22 °C towards −80 °C at 30 K/h. Thresholds are the module's rules
// of thumb (common practice, no source): at setpoint within 3 K, plateau within 1.5 K for 45 min or more.
describe('analysePullDown', () => {
  it('measures a clean pull-down: rate and time to setpoint', () => {
    const r = analysePullDown(series(pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30 }, 8 * 60)), { setpointC: -80 })
    expect(r.pullDowns).toHaveLength(1)
    const pd = r.pullDowns[0]!
    expect(pd.reached).toBe(true)
    // 22 − 0.5 K per minute reaches −77 °C (setpoint + 3 K) after 99 K / 0.5 K/min = 198 min; the series
    // starts one step below 22 °C, so 197 min from its first point.
    expect(pd.minutesToSetpoint).toBeCloseTo(197, 0)
    expect(pd.averageRateKPerHour).toBeCloseTo(30, 0)
    expect(pd.initialRateKPerHour).toBeCloseTo(30, 0)
    expect(r.stalls).toEqual([])
    expect(r.symptoms).toEqual([])
  })

  it('finds a known plateau above the setpoint: level, length and K above setpoint', () => {
    // Falls at 30 K/h, stops at −45 °C for 180 min, then continues to −80 °C.
    const cabinet = pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30, stall: { levelC: -45, minutes: 180 } }, 10 * 60)
    const r = analysePullDown(series(cabinet), { setpointC: -80 })
    expect(r.stalls).toHaveLength(1)
    const s = r.stalls[0]!
    expect(s.levelC).toBeCloseTo(-45, 0)
    expect(s.aboveSetpointK).toBeCloseTo(35, 0)
    // The plateau is 180 min of −45 ± 0.2 °C; the minute before and after lie within the 1.5 K band too.
    expect(s.minutes).toBeGreaterThanOrEqual(179)
    expect(s.minutes).toBeLessThanOrEqual(184)
    expect(s.running).toBeNull()
    expect(r.notes.join(' ')).toMatch(/assume the compressor was running/)
    expect(r.symptoms.map((x) => x.symptom)).toContain('not-cooling') // 35 K above setpoint
    expect(r.symptoms.find((x) => x.symptom === 'not-cooling')!.evidence).toMatch(/stalled at −45\.0 °C, 35 K above the setpoint, for 1\d\d min/)
    // And the pull-down as a whole was slow: 102 K at 20 K/h is 5.1 h expected, it took about 6.4 h.
    expect(r.symptoms.map((x) => x.symptom)).toContain('slow-pulldown')
  })

  it('does not call a plateau a stall when the compressor was off, nor when it sits at the setpoint', () => {
    const cabinet = pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30, stall: { levelC: -45, minutes: 180 } }, 10 * 60)
    const off = cabinet.map((c) => (Math.abs(c + 45) < 0.5 ? 0 : 1))
    expect(analysePullDown(series(cabinet, { running: off }), { setpointC: -80 }).stalls).toEqual([])
    const atSetpoint = analysePullDown(series(pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30 }, 12 * 60)), { setpointC: -80 })
    expect(atSetpoint.stalls).toEqual([])
  })

  it('ignores a plateau shorter than the minimum length', () => {
    const cabinet = pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30, stall: { levelC: -45, minutes: 30 } }, 8 * 60)
    expect(analysePullDown(series(cabinet), { setpointC: -80 }).stalls).toEqual([])
    expect(analysePullDown(series(cabinet), { setpointC: -80, stallMinMinutes: 20 }).stalls).toHaveLength(1)
  })

  it('tells a cabinet at room temperature with the compressor running as not cooling', () => {
    const cabinet = Array.from({ length: 180 }, (_, m) => 21 + 0.3 * Math.sin(m / 5))
    const r = analysePullDown(series(cabinet, { running: cabinet.map(() => 1), ambientC: cabinet.map(() => 21.5) }), { setpointC: -80 })
    expect(r.stalls).toEqual([])
    expect(r.symptoms.map((s) => s.symptom)).toEqual(['not-cooling'])
    expect(r.symptoms[0]!.evidence).toMatch(/within 3 K of the room/)
  })

  it('offers intermittent cooling after repeated warm-ups from the setpoint', () => {
    const cabinet = [...pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30 }, 4 * 60)]
    for (let k = 0; k < 3; k++) {
      for (let m = 0; m < 30; m++) cabinet.push(-80 + m) // warms to −51 °C over 30 min
      for (let m = 0; m < 30; m++) cabinet.push(-51 - m) // and recovers
      for (let m = 0; m < 60; m++) cabinet.push(-80)
    }
    const r = analysePullDown(series(cabinet), { setpointC: -80 })
    expect(r.warmUps).toHaveLength(3)
    expect(r.symptoms.map((s) => s.symptom)).toContain('intermittent-cooling')
  })

  it('offers not-cooling, or compressor-not-starting, when the cabinet warms and does not recover', () => {
    const cabinet = [...Array.from({ length: 60 }, () => -80), ...Array.from({ length: 240 }, (_, m) => -80 + m / 6)] // +40 K over 4 h
    const running = analysePullDown(series(cabinet, { running: cabinet.map(() => 1) }), { setpointC: -80 })
    expect(running.symptoms.map((s) => s.symptom)).toContain('not-cooling')
    expect(running.symptoms.find((s) => s.symptom === 'not-cooling')!.evidence).toMatch(/had not recovered .* with the compressor running/)
    const off = analysePullDown(series(cabinet, { running: cabinet.map((_, m) => (m < 60 ? 1 : 0)) }), { setpointC: -80 })
    expect(off.symptoms.map((s) => s.symptom)).toContain('compressor-not-starting')
  })

  it('offers warming over days when the daily lowest temperature creeps up', () => {
    const cabinet = Array.from({ length: 4 * 24 * 60 }, (_, m) => -80 + m / (24 * 60) + 0.5 * Math.sin(m / 30))
    const r = analysePullDown(series(cabinet), { setpointC: -80, setpointToleranceK: 6 })
    expect(r.symptoms.map((s) => s.symptom)).toContain('warming-over-days')
  })

  it('still gives the pull-down rate without a setpoint, and says what it cannot tell', () => {
    const r = analysePullDown(series(pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30 }, 6 * 60)), { setpointC: null })
    expect(r.pullDowns[0]!.averageRateKPerHour).toBeCloseTo(30, 0)
    expect(r.notes[0]).toMatch(/No setpoint known/)
  })
})
