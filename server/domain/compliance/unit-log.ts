/**
 * Everything the refrigerant-log page of one unit shows, from plain records: each stage's log with
 * the leak rate after every addition (both US methods, judged against the organisation's jurisdiction
 * for the unit's appliance type), the EU F-gas view under each regulation, and the unit's open duties.
 * A stage whose nameplate charge is unknown keeps its lines and charge history without leak rates.
 */
import type { ApplianceType, LeakRateMethod } from '#shared/types/compliance'
import type { Stage } from '#shared/types/diagnosis'
import type { FGasViewDto, StageLogDto, UnitComplianceSettingsDto } from '#shared/types/refrigerant-log'
import { complianceDuties, type Duty, type DutyUnit } from './duties'
import { assessFGasEquipment } from './f-gas'
import { stageRefrigerantLog, type LogCheck, type LogTransaction } from './refrigerant-log'
import { F_GAS_REGIMES, requireJurisdiction } from './regulation-data'
import { canonicalDesignation } from './substances'
import { clean } from './words'

export interface LogUnit {
  id: number
  name: string
  stages: { stage: Stage; refrigerant: string; chargeG: number | null }[]
  settings: UnitComplianceSettingsDto
}

export interface UnitLogView {
  stages: StageLogDto[]
  fGas: FGasViewDto[]
  duties: Duty[]
}

/** The stages the compliance rules can judge: a known refrigerant and a nameplate charge above 0. */
function judgeable(s: LogUnit['stages'][number]): boolean {
  return s.chargeG !== null && s.chargeG > 0 && canonicalDesignation(s.refrigerant) !== undefined
}

/** A log without leak rates, for a stage whose charge or refrigerant the rules cannot use. */
function plainLog(stage: LogUnit['stages'][number], lines: LogTransaction[]): StageLogDto {
  const own = lines.filter((t) => t.stage === stage.stage).sort((a, b) => new Date(a.at).getTime() - new Date(b.at).getTime())
  const added = own.filter((t) => t.direction === 'added').reduce((s, t) => s + t.grams, 0)
  const recovered = own.filter((t) => t.direction === 'recovered').reduce((s, t) => s + t.grams, 0)
  const why = stage.chargeG === null || stage.chargeG <= 0
    ? 'The register has no nameplate charge for this stage: enter it on the unit to get leak rates and a charge history.'
    : `${stage.refrigerant} is not in the compliance tables: no leak rate or CO2-equivalent is worked out for it.`
  return {
    stage: stage.stage, refrigerant: stage.refrigerant, fullChargeG: stage.chargeG, additions: [], currentChargeG: null,
    entries: own.map((t, index) => ({
      index, ...(t.id !== undefined ? { id: t.id } : {}), at: new Date(t.at).toISOString(), day: new Date(t.at).toISOString().slice(0, 10), direction: t.direction,
      grams: t.grams, refrigerant: t.refrigerant, cylinder: t.cylinder?.trim() || null, technician: t.technician ?? null, caseId: t.caseId ?? null,
      purpose: t.purpose ?? null, chargeAfterG: 0, countedAsLossG: 0, warnings: [],
    })),
    totalAddedG: clean(added), totalRecoveredG: clean(recovered), presumedLostG: 0, recoveredByCylinder: [], warnings: [why],
  }
}

/** The F-gas view of the unit's circuits under every regulation on file (2014 and 2024). */
export function fGasViews(unit: LogUnit): FGasViewDto[] {
  const circuits = unit.stages.filter(judgeable).map((s) => ({ designation: s.refrigerant, chargeG: s.chargeG! }))
  return [...F_GAS_REGIMES.keys()].map((basis) => {
    const r = assessFGasEquipment({ basis, circuits, hermeticallySealed: unit.settings.hermeticallySealed, leakDetectionSystem: unit.settings.leakDetectionSystem })
    const skipped = unit.stages.filter((s) => !judgeable(s)).map((s) => `The ${s.stage} stage (${s.refrigerant}) is left out: its charge or refrigerant is not known to the tables.`)
    return {
      basis: r.basis, regulation: r.regulation, annexITonnesCo2e: r.annexITonnesCo2e, leakCheckRequired: r.leakCheckRequired,
      leakCheckIntervalMonths: r.leakCheckIntervalMonths, hermeticExemption: r.hermeticExemption, leakDetectionSystemRequired: r.leakDetectionSystemRequired,
      circuits: r.circuits.map((c) => ({ designation: c.designation, chargeG: c.chargeG, gwp: c.gwp, tonnesCo2e: c.tonnesCo2e, fGas: c.fGas })),
      text: [...r.text, ...skipped], sources: r.sources,
    }
  })
}

/** The unit in the shape the duties module takes (stages the rules can judge only). */
export function dutyUnit(unit: LogUnit): DutyUnit {
  return {
    id: unit.id, name: unit.name, applianceType: unit.settings.applianceType as ApplianceType,
    hermeticallySealed: unit.settings.hermeticallySealed, leakDetectionSystem: unit.settings.leakDetectionSystem,
    stages: unit.stages.filter(judgeable).map((s) => ({ stage: s.stage, refrigerant: s.refrigerant, fullChargeG: s.chargeG! })),
  }
}

/** Builds the log page of one unit; `today` decides which duties are open. */
export function unitLogView(
  unit: LogUnit,
  lines: LogTransaction[],
  checks: LogCheck[],
  context: { jurisdiction: string; method: LeakRateMethod; today: Date },
): UnitLogView {
  const j = requireJurisdiction(context.jurisdiction)
  const stages = unit.stages.map((s): StageLogDto => {
    if (!judgeable(s)) return plainLog(s, lines)
    const log = stageRefrigerantLog({ stage: s.stage, refrigerant: s.refrigerant, fullChargeG: s.chargeG! }, lines, {
      checks, method: context.method, jurisdiction: j.id, applianceType: unit.settings.applianceType,
    })
    return { ...log, fullChargeG: log.fullChargeG, currentChargeG: log.currentChargeG }
  })
  const duties = complianceDuties({
    units: [dutyUnit(unit)],
    transactions: lines.map((t) => ({ ...t, unitId: unit.id })),
    checks: checks.map((c) => ({ ...c, unitId: unit.id })),
    jurisdiction: j.id, today: context.today, method: context.method,
  }).duties
  return { stages, fGas: fGasViews(unit), duties }
}
