import type { UnitDto, UnitStageDto } from '#shared/types/equipment-dto'
import { resolveRefrigerant } from '#shared/utils/calculator'
import { findRefrigerant, type Designation } from '#shared/utils/properties'

export interface PickedStage {
  unit: UnitDto
  stage: UnitStageDto
}

/** Key of a unit's stage in the picker ("12:low"). */
export const stageKeyOf = (unit: UnitDto, stage: UnitStageDto) => `${unit.id}:${stage.stage}`

/**
 * The calculator's selection: a refrigerant, or a stage of one of the user's units, which also sets the
 * refrigerant and the local atmosphere (site altitude). Page-local state, so nothing leaks between requests.
 */
export function useCalculatorSelection(units: Ref<UnitDto[]>) {
  const designation = ref<Designation>('R170')
  const stageKey = ref('')

  const picked = computed<PickedStage | null>(() => {
    for (const unit of units.value) {
      for (const stage of unit.stages) if (stageKeyOf(unit, stage) === stageKey.value) return { unit, stage }
    }
    return null
  })
  const stageProblem = computed(() => {
    const p = picked.value
    return p && !findRefrigerant(p.stage.refrigerant) ? `${p.unit.name}: the calculator has no data for its refrigerant "${p.stage.refrigerant}".` : ''
  })

  watch(picked, (p) => {
    const info = p ? findRefrigerant(p.stage.refrigerant) : undefined
    if (info) designation.value = info.designation
  })
  // Choosing another refrigerant by hand means the picked stage no longer applies.
  watch(designation, (d) => {
    if (picked.value && findRefrigerant(picked.value.stage.refrigerant)?.designation !== d) stageKey.value = ''
  })

  const refrigerant = computed(() => resolveRefrigerant(designation.value))
  const atmosphere = computed(() => {
    const unit = picked.value?.unit
    return localAtmosphere(unit ? { altitudeM: unit.siteAltitudeM, name: unit.site } : undefined)
  })

  return { designation, stageKey, picked, stageProblem, refrigerant, atmosphere }
}
