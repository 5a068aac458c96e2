// A stage refilled with another refrigerant (or another charge): what the nameplate record keeps and
// what the technician must hear about the change. Pure: no I/O.
import type { NameplateBasis, UnitDto } from '#shared/types/equipment-dto'
import type { Stage } from '#shared/types/diagnosis'
import { safetyClassWarnings } from '#shared/utils/charging'
import { findRefrigerant } from '#shared/utils/properties'
import { stageLabel, stageList } from '#shared/utils/vocabulary'
import { BadInputError } from '../errors'

export interface RefillInput {
  stage: Stage
  refrigerant: string
  chargeG?: number | null
  basis: NameplateBasis
  note?: string
}

export interface PlannedRefill {
  stage: Stage
  refrigerant: string
  chargeG: number | null
  previousRefrigerant: string
  previousChargeG: number | null
  basis: NameplateBasis
  note: string
  /** Changes of safety class and the like, in words, to show and to keep with the case. */
  warnings: string[]
}

/** Checks a refill against the unit and says what changes; 400 for a stage the unit lacks. */
export function planRefill(unit: Pick<UnitDto, 'name' | 'stages'>, input: RefillInput): PlannedRefill {
  const stage = unit.stages.find((s) => s.stage === input.stage)
  if (!stage) {
    const message = `${stageLabel(input.stage)} is not a stage of ${unit.name}; it has ${stageList(unit.stages.map((s) => s.stage))}`
    throw new BadInputError(message, { stage: [message] })
  }
  const from = findRefrigerant(stage.refrigerant)
  const to = findRefrigerant(input.refrigerant)
  const warnings = from && to && from.designation !== to.designation ? safetyClassWarnings(from, to) : []
  return {
    stage: input.stage,
    refrigerant: to?.designation ?? input.refrigerant,
    chargeG: input.chargeG ?? null,
    previousRefrigerant: stage.refrigerant,
    previousChargeG: stage.chargeG,
    basis: input.basis,
    note: input.note ?? '',
    warnings,
  }
}
