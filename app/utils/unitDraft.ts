// The unit form keeps what the technician typed as text (so "9,5" or a half-typed "-" survive a
// re-render) and turns it into the API's numbers only when checking or sending.
import { STAGES_OF_KIND } from '#shared/schemas/diagnosis'
import type { UnitInputDraft } from '#shared/schemas/equipment'
import type { MeteringDevice, Stage, UnitKind } from '#shared/types/diagnosis'
import type { EquipmentClass } from '#shared/types/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'
import { decimalText, decimalOrNull } from './decimal'

export const STAGE_NUMBER_FIELDS = ['chargeG', 'volumeL', 'referenceStandingPressureKpa', 'referenceAmbientC', 'ratedCurrentA', 'designPressureKpa'] as const
export type StageNumberField = (typeof STAGE_NUMBER_FIELDS)[number]
export type StageDraft = { refrigerant: string; meteringDevice: MeteringDevice | '' } & Record<StageNumberField, string>

export interface UnitDraft {
  name: string
  model: string
  serial: string
  kind: UnitKind
  equipmentClass: EquipmentClass | ''
  location: string
  siteId: string
  designCabinetC: string
  designCascadeHxC: string
  // Every stage is kept, so switching the kind back and forth loses nothing already typed.
  stages: Record<Stage, StageDraft>
}

const blankStage = (refrigerant = ''): StageDraft => ({ refrigerant, meteringDevice: '', chargeG: '', volumeL: '', referenceStandingPressureKpa: '', referenceAmbientC: '', ratedCurrentA: '', designPressureKpa: '' })

/** An empty form, optionally at a preselected site. */
export function emptyUnitDraft(siteId = ''): UnitDraft {
  return {
    name: '', model: '', serial: '', kind: 'cascade', equipmentClass: 'ult-freezer', location: '', siteId,
    designCabinetC: '', designCascadeHxC: '', stages: { high: blankStage(), low: blankStage(), single: blankStage() },
  }
}

/** The form filled from a saved unit. */
export function unitDraftFrom(unit: UnitDto): UnitDraft {
  const draft = emptyUnitDraft(String(unit.siteId))
  Object.assign(draft, {
    name: unit.name, model: unit.model, serial: unit.serial, kind: unit.kind, equipmentClass: unit.equipmentClass, location: unit.location,
    designCabinetC: decimalText(unit.design.cabinetC), designCascadeHxC: decimalText(unit.design.cascadeHxC),
  })
  for (const s of unit.stages) {
    draft.stages[s.stage] = { refrigerant: s.refrigerant, meteringDevice: s.meteringDevice ?? '', ...Object.fromEntries(STAGE_NUMBER_FIELDS.map((f) => [f, decimalText(s[f])])) } as StageDraft
  }
  return draft
}

/** The stages the chosen kind has, in the order the API numbers them (stages.0, stages.1). */
export function stagesOfDraft(draft: UnitDraft): readonly Stage[] {
  return STAGES_OF_KIND[draft.kind]
}

/** The request body the draft stands for, still unchecked: the shared schema judges it. */
export function unitInputFrom(draft: UnitDraft): UnitInputDraft {
  return {
    name: draft.name, model: draft.model, serial: draft.serial, kind: draft.kind,
    equipmentClass: draft.equipmentClass as EquipmentClass, location: draft.location,
    siteId: draft.siteId === '' ? Number.NaN : Number(draft.siteId),
    designCabinetC: decimalOrNull(draft.designCabinetC),
    designCascadeHxC: draft.kind === 'cascade' ? decimalOrNull(draft.designCascadeHxC) : null,
    stages: stagesOfDraft(draft).map((stage) => {
      const s = draft.stages[stage]
      return { stage, refrigerant: s.refrigerant, meteringDevice: s.meteringDevice || null, ...Object.fromEntries(STAGE_NUMBER_FIELDS.map((f) => [f, decimalOrNull(s[f])])) }
    }),
  }
}
