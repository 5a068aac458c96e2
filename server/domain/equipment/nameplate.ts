// A stage refilled with another refrigerant (or another charge): what the nameplate record keeps and
// what the technician must hear about the change. Pure: no I/O.
import type { NameplateBasis, UnitDto } from '#shared/types/equipment-dto'
import type { Stage } from '#shared/types/diagnosis'
import { safetyClassWarnings } from '#shared/utils/charging'
import { formatPressure, formatQuantity } from '#shared/utils/format'
import { findRefrigerant } from '#shared/utils/properties'
import { stageLabel, stageList } from '#shared/utils/vocabulary'
import { BadInputError } from '../errors'

export interface RefillInput {
  stage: Stage
  refrigerant: string
  chargeG?: number | null
  basis: NameplateBasis
  note?: string
  /** Where the new fill stands (absolute kPa) at `ambientC`, planned or measured. */
  standingPressureKpa?: number | null | undefined
  ambientC?: number | null | undefined
}

/** A standing pressure with the ambient it stands at: what a stage's expected standing pressure is shifted from. */
export interface StandingReference { standingPressureKpa: number; ambientC: number }

export interface PlannedRefill {
  stage: Stage
  refrigerant: string
  chargeG: number | null
  previousRefrigerant: string
  previousChargeG: number | null
  basis: NameplateBasis
  note: string
  /** The figures given with the refill, kept on its record; null when none were given. */
  given: StandingReference | null
  /**
   * The stage's reference standing pressure after the refill: the figures given with it; else the
   * one on record while the fill stays the same; else none, since a reference taken with another
   * refrigerant or charge would make the diagnosis expect a pressure the new fill never stands at.
   */
  reference: StandingReference | null
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
  const refrigerant = to?.designation ?? input.refrigerant
  const chargeG = input.chargeG ?? null
  const given = input.standingPressureKpa != null && input.ambientC != null
    ? { standingPressureKpa: input.standingPressureKpa, ambientC: input.ambientC }
    : null
  const onRecord = stage.referenceStandingPressureKpa !== null && stage.referenceAmbientC !== null
    ? { standingPressureKpa: stage.referenceStandingPressureKpa, ambientC: stage.referenceAmbientC }
    : null
  const sameFill = refrigerant === stage.refrigerant && chargeG === stage.chargeG
  const reference = given ?? (sameFill ? onRecord : null)
  if (onRecord && !reference) {
    warnings.push(
      `The reference standing pressure on record (${formatPressure(onRecord.standingPressureKpa, { decimals: 0 })} at ${formatQuantity(onRecord.ambientC, 'C', 1)}) was taken with the previous fill and no longer applies, so it was cleared: `
      + 'until the new fill\'s standing pressure is measured at a known ambient and recorded on the unit, the expected standing pressure comes from the charge and the stage\'s volume.',
    )
  }
  if (given && stage.designPressureKpa !== null && given.standingPressureKpa > stage.designPressureKpa) {
    warnings.push(
      `The new fill stands at ${formatPressure(given.standingPressureKpa, { decimals: 0 })}, above the stage's design pressure of ${formatPressure(stage.designPressureKpa, { decimals: 0 })}: `
      + 'do not charge it; plan a smaller charge or an expansion volume, following the manufacturer and local pressure-equipment rules.',
    )
  }
  return {
    stage: input.stage,
    refrigerant,
    chargeG,
    previousRefrigerant: stage.refrigerant,
    previousChargeG: stage.chargeG,
    basis: input.basis,
    note: input.note ?? '',
    given,
    reference,
    warnings,
  }
}
