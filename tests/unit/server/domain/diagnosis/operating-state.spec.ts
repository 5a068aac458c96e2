import { describe, expect, it } from 'vitest'
import { healthyState, readingsForState, withState, type UnitShape } from '#server/domain/diagnosis/operating-state'
import { deriveFacts } from '#server/domain/diagnosis/facts'

const ult: UnitShape = {
  kind: 'cascade',
  design: { cabinetC: -80, cascadeHxC: -32 },
  stages: [
    { stage: 'high', refrigerant: 'R404A', chargeG: 520, ratedCurrentA: 6.2 },
    { stage: 'low', refrigerant: 'R170', chargeG: 210, volumeL: 9.5, ratedCurrentA: 4.1 },
  ],
}
const value = (readings: ReturnType<typeof readingsForState>, quantity: string, stage?: string) => readings.find((r) => r.quantity === quantity && r.stage === stage)?.value

describe('readings from an operating state', () => {
  it('puts pressures on the saturation curve: ethane at −80 °C is 157.4 kPa (Bücker & Wagner 2006 EOS, CoolProp 8.0.0)', () => {
    const readings = readingsForState(ult, withState(healthyState(ult, 22), { low: { sst: -80 } }))
    expect(value(readings, 'suctionPressure', 'low')).toBeCloseTo(157, 0)
  })

  it('reads gauges against the site’s atmosphere and rounds as a gauge is read', () => {
    const at = (altitudeM: number) => readingsForState(ult, withState(healthyState(ult, 22), { low: { sst: -80 } }), { pressure: 'psig', altitudeM })
    const sea = value(at(0), 'suctionPressure', 'low') as number
    const high = value(at(1500), 'suctionPressure', 'low') as number
    // ISO 2533: 84.56 kPa at 1500 m, so the same absolute pressure shows about 2.4 psi more on the gauge.
    expect(high - sea).toBeCloseTo((101.325 - 84.56) / 6.894757, 0)
    expect((sea * 2) % 1).toBe(0)
  })

  it('gives a healthy unit readings that derive back to its state', () => {
    const { facts } = deriveFacts({ unit: { kind: 'cascade', stages: ult.stages.map((s) => ({ stage: s.stage, refrigerant: s.refrigerant, chargeG: s.chargeG ?? undefined, volumeL: s.volumeL ?? undefined, ratedCurrentA: s.ratedCurrentA ?? undefined })), design: { cabinetC: -80, cascadeHxC: -32 } }, readings: readingsForState(ult, withState(healthyState(ult, 22), { low: { standingFraction: 1 } })) })
    expect(facts['low.evaporatingResidualK']).toBeCloseTo(0, 0)
    expect(facts['low.condensingResidualK']).toBeCloseTo(0, 0)
    expect(facts['high.condensingResidualK']).toBeCloseTo(0, 0)
    expect(facts['high.subcoolingK']).toBeCloseTo(4, 0)
    expect(facts['low.standingResidualPct'] as number).toBeLessThan(1)
  })

  it('shows no condensing pressure for a stage asked to condense above its refrigerant’s critical point', () => {
    const r14: UnitShape = { ...ult, stages: [ult.stages[0]!, { stage: 'low', refrigerant: 'R14', chargeG: 180, volumeL: 7 }] }
    // R14's critical temperature is −45.8 °C (Platzer et al. 1990): it cannot condense at −27 °C.
    const readings = readingsForState(r14, withState(healthyState(r14, 22), { low: { sst: -132, sct: -27 } }))
    expect(value(readings, 'dischargePressure', 'low')).toBeUndefined()
    expect(value(readings, 'suctionPressure', 'low')).toBeDefined()
  })
})
