import { describe, expect, it } from 'vitest'
import { ImplausibleInputError } from '#server/domain/errors'
import { evaluateStep, holdToleranceKpa, MICRON_KPA, stepCautions, temperatureCorrectedDrop } from '#server/domain/cases/repair-steps'
import { standingPressureFromCharge } from '#shared/utils/properties'

const PSI_KPA = 6.894757293168361 // 1 psi = 6.894 757 kPa (NIST SP 811)
const SEA_LEVEL = 101.325 // ISO 2533 standard atmosphere at 0 m
const low = { stage: 'low' as const, refrigerant: 'R170', chargeG: 90, volumeL: 7.5 }
const high = { stage: 'high' as const, refrigerant: 'R404A', chargeG: 400, volumeL: 8 }

function refusal(run: () => unknown): ImplausibleInputError {
  try {
    run()
  } catch (e) {
    if (e instanceof ImplausibleInputError) return e
    throw e
  }
  throw new Error('expected the step to be refused')
}

describe('pressure hold with the temperature correction', () => {
  it('keeps p/T constant for a closed volume of gas (ideal-gas law pV = nRT at fixed V and n; Gay-Lussac; Çengel & Boles, Thermodynamics, ch. 3)', () => {
    // By hand: 2000 kPa at 293.15 K cooled to 283.15 K stands at 2000 × 283.15 / 293.15 = 1931.776 kPa.
    const { expectedEndKpa, correctedDropKpa } = temperatureCorrectedDrop({ startKpa: 2000, endKpa: 1931.776, startK: 293.15, endK: 283.15 })
    expect(expectedEndKpa).toBeCloseTo((2000 * 283.15) / 293.15, 6)
    expect(expectedEndKpa).toBeCloseTo(1931.776, 2)
    expect(correctedDropKpa).toBeCloseTo(0, 2)
  })

  it('passes a hold whose gauge fell 4 psi while the stage cooled 5 K: the cooling explains it', () => {
    const result = evaluateStep({
      kind: 'pressure-hold', stage: 'low', gas: 'nitrogen', pressureUnit: 'psig', testPressure: 300, startPressure: 300, endPressure: 296,
      temperatureUnit: 'C', startTemperature: 20, endTemperature: 15, holdMinutes: 60,
    }, { stage: low, atmosphericKpa: SEA_LEVEL })
    // By hand: start 300 psig = 2169.752 kPa abs; end 296 psig = 2142.173 kPa abs; expected end 2169.752 × 288.15 / 293.15 = 2132.745 kPa abs,
    // so 9.4 kPa more than expected is left: no loss. Allowed: 0.5 % of 2169.75 = 10.85 kPa (common practice, no source).
    const start = 300 * PSI_KPA + SEA_LEVEL
    expect(holdToleranceKpa(start)).toBeCloseTo(10.849, 2)
    expect(result.verdict).toBe('pass')
    expect(result.figures.find((f) => f.label.startsWith('Drop after'))!.value).toBe('−9.4 kPa (allowed 10.8 kPa)')
    expect(result.figures.find((f) => f.label.startsWith('End pressure the temperature'))!.value).toBe('294.6 psig')
  })

  it('fails a hold that lost 20 psi at a steady temperature, and warns about a short hold', () => {
    const result = evaluateStep({
      kind: 'pressure-hold', stage: 'low', gas: 'nitrogen', pressureUnit: 'psig', testPressure: 300, startPressure: 300, endPressure: 280,
      temperatureUnit: 'C', startTemperature: 20, endTemperature: 20, holdMinutes: 10,
    }, { stage: low, atmosphericKpa: SEA_LEVEL })
    expect(result.verdict).toBe('fail')
    // 20 psi = 137.9 kPa (NIST SP 811 factor).
    expect(result.summary).toContain('137.9 kPa lost')
    expect(result.warnings.join(' ')).toMatch(/shows only large leaks/)
  })

  it('refuses a hold below atmospheric pressure and a temperature below absolute zero', () => {
    const base = { kind: 'pressure-hold' as const, stage: 'low' as const, gas: 'nitrogen' as const, pressureUnit: 'psig' as const, testPressure: 0, startPressure: 0, endPressure: 0, temperatureUnit: 'C' as const, startTemperature: 20, endTemperature: 20, holdMinutes: 30 }
    expect(refusal(() => evaluateStep(base, { stage: low, atmosphericKpa: SEA_LEVEL })).fieldErrors.testPressure).toBeDefined()
    expect(refusal(() => evaluateStep({ ...base, testPressure: 150, startPressure: 150, endPressure: 150, endTemperature: -300 }, { stage: low, atmosphericKpa: SEA_LEVEL })).fieldErrors.endTemperature).toBeDefined()
  })
})

describe('evacuation and vacuum decay', () => {
  // 1 micron of mercury = 0.133 322 Pa (1 mmHg = 133.322 387 415 Pa, NIST SP 811).
  it('passes 350 microns reached and 700 after 10 minutes isolated against a 500 micron target (common practice, no source)', () => {
    expect(MICRON_KPA * 1e6).toBeCloseTo(133.322, 3)
    const result = evaluateStep({ kind: 'evacuation', stage: 'low', vacuumUnit: 'micron', target: 500, reached: 350, decayMinutes: 10, afterDecay: 700 }, { stage: low, atmosphericKpa: SEA_LEVEL })
    expect(result.verdict).toBe('pass')
    expect(result.figures.find((f) => f.label === 'Rise while isolated')!.value).toMatch(/^350 /)
  })

  it('fails a vacuum that rises to 2500 microns, and is unfinished when the target was not reached', () => {
    expect(evaluateStep({ kind: 'evacuation', stage: 'low', vacuumUnit: 'micron', target: 500, reached: 400, decayMinutes: 15, afterDecay: 2500 }, { stage: low, atmosphericKpa: SEA_LEVEL }).verdict).toBe('fail')
    expect(evaluateStep({ kind: 'evacuation', stage: 'low', vacuumUnit: 'micron', target: 500, reached: 900, decayMinutes: 15, afterDecay: 950 }, { stage: low, atmosphericKpa: SEA_LEVEL }).verdict).toBe('incomplete')
  })
})

describe('hot work', () => {
  const all = { recovered: true, purgedWithNitrogen: true, atmosphereChecked: true, permit: true, nitrogenFlowWhileBrazing: true, extinguisher: true }
  it('refuses brazing on a stage that held ethane (A3, flammable) until every check is done, naming the missing one', () => {
    const error = refusal(() => evaluateStep({ kind: 'hot-work', stage: 'low', task: 'Brazed an access fitting', checklist: { ...all, atmosphereChecked: false } }, { stage: low, atmosphericKpa: SEA_LEVEL }))
    expect(Object.keys(error.fieldErrors)).toEqual(['checklist.atmosphereChecked'])
    expect(error.message).toMatch(/R170, which is flammable/)
    expect(evaluateStep({ kind: 'hot-work', stage: 'low', task: 'Brazed an access fitting', checklist: all }, { stage: low, atmosphericKpa: SEA_LEVEL }).verdict).toBe('done')
  })

  it('asks less on a non-flammable stage (R404A is class A1) but still the recovery, the nitrogen flow and the extinguisher', () => {
    const some = { recovered: true, purgedWithNitrogen: false, atmosphereChecked: false, permit: false, nitrogenFlowWhileBrazing: true, extinguisher: true }
    expect(evaluateStep({ kind: 'hot-work', stage: 'high', task: 'Brazed the drier', checklist: some }, { stage: high, atmosphericKpa: SEA_LEVEL }).verdict).toBe('done')
    expect(Object.keys(refusal(() => evaluateStep({ kind: 'hot-work', stage: 'high', task: 'Brazed the drier', checklist: { ...some, recovered: false } }, { stage: high, atmosphericKpa: SEA_LEVEL })).fieldErrors)).toEqual(['checklist.recovered'])
  })
})

describe('cautions belong to the step, the stage and the refrigerant worked on', () => {
  it('never mixes the other stage\'s refrigerant warnings into a step', () => {
    const ethane = stepCautions('recharge', 'R170').join(' ')
    expect(ethane).toMatch(/flammable/)
    expect(ethane).not.toMatch(/hydrogen fluoride/)
    expect(stepCautions('recharge', 'R404A').join(' ')).toMatch(/hydrogen fluoride/)
    expect(stepCautions('hot-work', 'R404A').join(' ')).not.toMatch(/flammable refrigerant/)
    expect(stepCautions('hot-work', 'R170').join(' ')).toMatch(/flammable atmosphere/)
    expect(stepCautions('pressure-hold', 'R170').join(' ')).toMatch(/never oxygen/)
  })
})

describe('recharge', () => {
  it('by standing pressure: the pressure the nameplate charge stands at reads as on target (round trip through the equation of state)', () => {
    const target = standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 7.5, chargeG: 90 })
    const gauge = (target.pressureKpa - SEA_LEVEL) / PSI_KPA
    const result = evaluateStep({ kind: 'recharge', stage: 'low', method: 'standing-pressure', pressure: gauge, pressureUnit: 'psig', ambientC: 22 }, { stage: low, atmosphericKpa: SEA_LEVEL })
    expect(result.verdict).toBe('pass')
    expect(result.figures.find((f) => f.label === 'Share of the target')!.value).toBe('100 %')
    expect(result.cautions.join(' ')).not.toMatch(/hydrogen fluoride/)
  })

  it('by standing pressure at half the pressure: grams to go, not finished', () => {
    const result = evaluateStep({ kind: 'recharge', stage: 'low', method: 'standing-pressure', pressure: 40, pressureUnit: 'psig', ambientC: 22 }, { stage: low, atmosphericKpa: SEA_LEVEL })
    expect(result.verdict).toBe('incomplete')
    expect(result.summary).toMatch(/to go/)
  })

  it('by standing pressure: the grams to go are the target less the grams the pressure shows', () => {
    const result = evaluateStep({ kind: 'recharge', stage: 'low', method: 'standing-pressure', pressure: 40, pressureUnit: 'psig', ambientC: 22 }, { stage: low, atmosphericKpa: SEA_LEVEL })
    // By hand: 40 psig = 40 × 6.894757 + 101.325 = 377.115 kPa abs; the equation of state gives the grams at that pressure.
    const inStage = Number(result.figures.find((f) => f.label === 'Grams in the stage')!.value.replace(/[^\d.]/g, ''))
    const toGo = Number(result.figures.find((f) => f.label === 'Grams to go')!.value.replace(/[^\d.]/g, ''))
    expect(Math.abs(inStage + toGo - 90)).toBeLessThanOrEqual(1)
  })

  it('by scale with the room temperature: the standing pressure to expect, round trip through the equation of state', () => {
    // 45 g weighed in on top of 30 g in 7.5 L at 22 °C: the pressure 75 g of ethane stands at (Bücker & Wagner 2006 EOS).
    const expected = standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 7.5, chargeG: 75 })
    const gauge = (expected.pressureKpa - SEA_LEVEL) / PSI_KPA
    const result = evaluateStep({ kind: 'recharge', stage: 'low', method: 'scale', grams: 45, startGrams: 30, ambientC: 22, pressureUnit: 'psig' }, { stage: low, atmosphericKpa: SEA_LEVEL })
    expect(result.verdict).toBe('done')
    expect(result.figures.find((f) => f.label === 'Standing pressure to expect, settled')!.value).toBe(`${gauge.toFixed(1)} psig at 22.0 °C room`)
    expect(result.figures.find((f) => f.label === 'Grams in the stage')!.value).toBe('75 g')
    expect(result.figures.find((f) => f.label === 'Grams to go')!.value).toBe('15 g')
    expect(result.figures.find((f) => f.label === 'Share of the target')!.value).toBe('83 %')
    expect(result.summary).toMatch(/15 g to go\. Once settled at 22\.0 °C it should stand at/)
    // Past the target: how far over, not a negative "to go".
    const over = evaluateStep({ kind: 'recharge', stage: 'low', method: 'scale', grams: 100 }, { stage: low, atmosphericKpa: SEA_LEVEL })
    expect(over.figures.find((f) => f.label === 'Over the target by')!.value).toBe('10 g')
  })

  it('by scale: the expected pressure is checked against the stage design pressure', () => {
    // 90 g of ethane in 7.5 L at 22 °C (12 kg/m³) stands near 0.9 MPa abs (Bücker & Wagner 2006 EOS); a 700 kPa abs design pressure is below it.
    const result = evaluateStep({ kind: 'recharge', stage: 'low', method: 'scale', grams: 90, ambientC: 22 }, { stage: { ...low, designPressureKpa: 700 }, atmosphericKpa: SEA_LEVEL })
    expect(result.warnings.join(' ')).toMatch(/^DANGER/)
  })

  it('by scale: grams against the nameplate charge; standing pressure needs the stage volume', () => {
    expect(evaluateStep({ kind: 'recharge', stage: 'low', method: 'scale', grams: 90 }, { stage: low, atmosphericKpa: SEA_LEVEL }).figures.find((f) => f.label === 'Share of the target')!.value).toBe('100 %')
    expect(refusal(() => evaluateStep({ kind: 'recharge', stage: 'low', method: 'standing-pressure', pressure: 40, pressureUnit: 'psig', ambientC: 22 }, { stage: { ...low, volumeL: null }, atmosphericKpa: SEA_LEVEL })).fieldErrors.stage).toBeDefined()
  })
})
