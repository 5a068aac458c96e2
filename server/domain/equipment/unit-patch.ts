// Turns a PATCH of a unit into the whole unit it asks for, so that the route can check the result
// with the same schema as a new unit (kind against stages, design temperatures together).
import type { UnitInputDraft, UnitPatch } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'

/** The saved unit overlaid with the patch; sent `stages` replace all stages. */
export function mergeUnitPatch(saved: UnitDto, patch: UnitPatch): UnitInputDraft {
  const kind = patch.kind ?? saved.kind
  const merged: UnitInputDraft = {
    name: patch.name ?? saved.name,
    model: patch.model ?? saved.model,
    serial: patch.serial ?? saved.serial,
    kind,
    equipmentClass: patch.equipmentClass ?? saved.equipmentClass,
    location: patch.location ?? saved.location,
    siteId: patch.siteId ?? saved.siteId,
    designCabinetC: patch.designCabinetC !== undefined ? patch.designCabinetC : saved.design.cabinetC,
    designCascadeHxC: patch.designCascadeHxC !== undefined ? patch.designCascadeHxC : saved.design.cascadeHxC,
    stages: patch.stages ?? saved.stages.map((s) => ({ ...s })),
  }
  // Turning a cascade into a single-stage unit retires its cascade heat exchanger unless the patch says otherwise.
  if (kind !== 'cascade' && patch.designCascadeHxC === undefined) merged.designCascadeHxC = null
  return merged
}
