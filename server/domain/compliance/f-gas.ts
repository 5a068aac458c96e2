/**
 * EU F-gas view of a piece of equipment: tonnes of CO2 equivalent (charge in kg × GWP ÷ 1000, with the
 * GWP of the regulation's own table) and the leak-check interval that follows from it, under
 * Regulation (EU) No 517/2014 (Art. 4–5) or Regulation (EU) 2024/573 (Art. 4–6). Since 2024, unsaturated
 * HFCs of Annex II group 1 are counted in kilograms instead. Tables and intervals come from data/f-gas.
 */
import type { Co2eDto, FGasBasis, FGasScope, SourceRef } from '#shared/types/compliance'
import { BadInputError, NotFoundError } from '#server/domain/errors'
import { F_GAS_REGIMES, sourceOf, type FGasRegime } from './regulation-data'
import { requireDesignation } from './substances'
import { clean, figure } from './words'

export interface FGasCircuit {
  designation: string
  chargeG: number
}

export interface FGasEquipmentInput {
  circuits: FGasCircuit[]
  basis: FGasBasis | string
  hermeticallySealed?: boolean
  leakDetectionSystem?: boolean
}

export interface FGasCircuitResult {
  designation: string
  chargeG: number
  scope: FGasScope
  fGas: boolean
  gwp: number | null
  tonnesCo2e: number | null
  reason?: string
}

export interface FGasEquipmentResult {
  basis: string
  regulation: string
  circuits: FGasCircuitResult[]
  /** Tonnes CO2e of the Annex I gases, which the leak-check bands are set in. */
  annexITonnesCo2e: number
  /** Kilograms of Annex II group 1 gases (2024 regulation only). */
  annexIIGroup1Kg: number
  leakCheckRequired: boolean
  leakCheckIntervalMonths: number | null
  hermeticExemption: boolean
  leakDetectionSystemRequired: boolean
  recheckAfterRepair: { withinMonths: number; notBeforeHours: number; citation: string } | null
  text: string[]
  sources: SourceRef[]
}

/** The regulation data of a basis; an unknown basis is a NotFoundError. */
export function requireRegime(basis: string): FGasRegime {
  const regime = F_GAS_REGIMES.get(basis)
  if (!regime) throw new NotFoundError(`Unknown F-gas basis "${basis}"; known: ${[...F_GAS_REGIMES.keys()].join(', ')}`)
  return regime
}

function circuitResult(regime: FGasRegime, c: FGasCircuit): FGasCircuitResult {
  if (!Number.isFinite(c.chargeG) || c.chargeG < 0) throw new BadInputError('A charge must be a number of at least 0 g')
  const designation = requireDesignation(c.designation)
  const gas = regime.gases[designation]
  if (!gas) {
    return { designation, chargeG: c.chargeG, scope: 'not-f-gas', fGas: false, gwp: null, tonnesCo2e: null, reason: `${regime.regulation} does not list ${designation}` }
  }
  return {
    designation,
    chargeG: c.chargeG,
    scope: gas.scope,
    fGas: gas.scope !== 'not-f-gas',
    gwp: gas.gwp,
    // kg × GWP ÷ 1000 = g × GWP ÷ 1 000 000
    tonnesCo2e: gas.gwp === null ? null : clean((c.chargeG * gas.gwp) / 1_000_000),
    ...(gas.reason ? { reason: gas.reason } : {}),
  }
}

interface Band {
  months: number
  monthsWithLeakDetection: number
}

function bandFor<B extends Band>(bands: B[], value: number, from: (b: B) => number, below: (b: B) => number | null): B | undefined {
  return bands.find((b) => value >= from(b) && (below(b) === null || value < below(b)!))
}

/** Works out the F-gas figures and leak-check duty of one piece of equipment (all its circuits together). */
export function assessFGasEquipment(input: FGasEquipmentInput): FGasEquipmentResult {
  const regime = requireRegime(input.basis)
  const lc = regime.leakChecks
  const circuits = input.circuits.map((c) => circuitResult(regime, c))
  const annexITonnesCo2e = clean(circuits.filter((c) => c.scope === 'annex-i').reduce((sum, c) => sum + (c.tonnesCo2e ?? 0), 0))
  const annexIIGroup1Kg = clean(circuits.filter((c) => c.scope === 'annex-ii-group-1').reduce((sum, c) => sum + c.chargeG / 1000, 0))
  const sources = new Map<string, SourceRef>()
  const cite = (key: string) => sources.set(key, sourceOf(regime.sources, key))
  for (const c of circuits) {
    const gas = regime.gases[c.designation]
    if (gas) cite(gas.source)
  }

  const tonnesBand = bandFor(lc.tonnesBands, annexITonnesCo2e, (b) => b.fromTonnes, (b) => b.belowTonnes)
  const kgBand = annexIIGroup1Kg > 0 ? bandFor(lc.kilogramBands, annexIIGroup1Kg, (b) => b.fromKilograms, (b) => b.belowKilograms) : undefined
  const inScope = !!(tonnesBand || kgBand)
  const ex = lc.hermeticExemption
  const hermeticExemption =
    inScope &&
    input.hermeticallySealed === true &&
    (annexITonnesCo2e === 0 || annexITonnesCo2e < ex.belowTonnes) &&
    (annexIIGroup1Kg === 0 || (ex.belowKilograms !== null && annexIIGroup1Kg < ex.belowKilograms))
  const lds = lc.leakDetectionRequired
  const leakDetectionSystemRequired = annexITonnesCo2e >= lds.fromTonnes || (lds.fromKilograms !== null && annexIIGroup1Kg >= lds.fromKilograms)
  const withLds = input.leakDetectionSystem === true
  const bands: Band[] = [...(tonnesBand ? [tonnesBand] : []), ...(kgBand ? [kgBand] : [])]
  const months = bands.map((b) => (withLds ? b.monthsWithLeakDetection : b.months))
  const leakCheckRequired = inScope && !hermeticExemption
  const leakCheckIntervalMonths = leakCheckRequired ? Math.min(...months) : null

  const text: string[] = []
  for (const c of circuits) {
    const amount = c.tonnesCo2e === null ? '' : ` = ${figure(c.tonnesCo2e, 3)} t CO2e`
    const gwp = c.gwp === null ? 'no GWP in this regulation' : `GWP ${figure(c.gwp, 3)}`
    if (c.fGas) text.push(`${c.designation}: ${figure(c.chargeG / 1000, 3)} kg × ${gwp} ÷ 1000${amount} (${regime.regulation})${c.reason ? `; ${c.reason}` : ''}.`)
    else text.push(`${c.designation} is not a fluorinated greenhouse gas under ${regime.regulation}: ${c.reason ?? 'not listed'}. No F-gas leak-check duty follows from it; national rules and EN 378 may still require checks.`)
  }
  if (circuits.length > 1 && circuits.some((c) => c.scope === 'annex-i')) {
    text.push(`All circuits of the equipment together: ${figure(annexITonnesCo2e, 3)} t CO2e of Annex I gases (circuits counted together, the stricter reading).`)
  }
  if (inScope) cite(lc.source)
  if (hermeticExemption) {
    cite(ex.source)
    text.push(`Labelled hermetically sealed and under the limits of ${ex.citation} (${ex.belowTonnes} t CO2e${ex.belowKilograms !== null ? `, ${ex.belowKilograms} kg of unsaturated HFCs` : ''}): no periodic leak check is required.`)
  } else if (leakCheckRequired) {
    const what = [tonnesBand ? `${figure(annexITonnesCo2e, 3)} t CO2e` : '', kgBand ? `${figure(annexIIGroup1Kg, 3)} kg of Annex II group 1 gases` : ''].filter(Boolean).join(' and ')
    if (withLds) cite(lc.leakDetectionMonthsSource)
    text.push(`${what}: leak check at least every ${leakCheckIntervalMonths} months (${lc.citation}${withLds ? ', interval with a leak detection system fitted' : ''}).`)
    if (input.hermeticallySealed === true) text.push(`Hermetically sealed, but at or above the exemption limit of ${ex.citation}, so checks are still required.`)
  } else if (circuits.some((c) => c.scope === 'annex-i' || c.scope === 'annex-ii-group-1')) {
    const min = lc.tonnesBands[0]!.fromTonnes
    text.push(`Below ${min} t CO2e${lc.kilogramBands.length ? ` and ${lc.kilogramBands[0]!.fromKilograms} kg of unsaturated HFCs` : ''}: ${regime.regulation} requires no periodic leak check.`)
  }
  if (leakDetectionSystemRequired) {
    cite(lds.source)
    text.push(`At this size a leak detection system is mandatory (${lds.citation})${withLds ? '' : ': none is recorded as fitted'}.`)
  }
  const r = lc.recheckAfterRepair
  if (leakCheckRequired) {
    cite(r.source)
    text.push(`After repairing a leak, have it checked ${r.notBeforeHours ? `no sooner than ${r.notBeforeHours} h and ` : ''}within ${r.withinMonths} month of the repair (${r.citation}).`)
  }
  return {
    basis: regime.id,
    regulation: regime.regulation,
    circuits,
    annexITonnesCo2e,
    annexIIGroup1Kg,
    leakCheckRequired,
    leakCheckIntervalMonths,
    hermeticExemption,
    leakDetectionSystemRequired,
    recheckAfterRepair: leakCheckRequired ? { withinMonths: r.withinMonths, notBeforeHours: r.notBeforeHours, citation: r.citation } : null,
    text,
    sources: [...sources.values()],
  }
}

export interface Co2eInput {
  designation: string
  chargeG: number
  basis: FGasBasis
  hermeticallySealed?: boolean
  leakDetectionSystem?: boolean
}

/** One refrigerant charge under one regulation: the contract's CO2e answer with its reasoning. */
export function co2eOfCharge(input: Co2eInput): Co2eDto {
  const result = assessFGasEquipment({
    circuits: [{ designation: input.designation, chargeG: input.chargeG }],
    basis: input.basis,
    hermeticallySealed: input.hermeticallySealed,
    leakDetectionSystem: input.leakDetectionSystem,
  })
  const c = result.circuits[0]!
  return {
    tonnesCo2e: c.tonnesCo2e,
    gwp: c.gwp,
    leakCheckIntervalMonths: result.leakCheckIntervalMonths,
    designation: c.designation,
    basis: input.basis,
    regulation: result.regulation,
    fGas: c.fGas,
    scope: c.scope,
    leakCheckRequired: result.leakCheckRequired,
    hermeticExemption: result.hermeticExemption,
    leakDetectionSystemRequired: result.leakDetectionSystemRequired,
    text: result.text,
    sources: result.sources,
  }
}
