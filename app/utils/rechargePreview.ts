/**
 * What the case's recharge form shows while the technician types, before the step is recorded: from a
 * settled standing pressure and the room temperature, the grams in the stage, the grams to go and the
 * share of the target; from grams weighed in, the standing pressure to expect. It runs the shared
 * charging module the server judges the step with, so the preview and the recorded step agree.
 */
import type { PressureReadingUnit } from '#shared/types/diagnosis'
import type { UnitStageDto } from '#shared/types/equipment-dto'
import { chargingProgress, type ChargingProgress } from '#shared/utils/charging'
import { findRefrigerant, toKpaAbs } from '#shared/utils/properties'
import { propertyProblem } from './calculatorViews'
import { parseDecimal } from './decimal'

/** The recharge fields of the step form, as typed. */
export interface RechargeForm {
  method: 'scale' | 'standing-pressure'
  grams: string
  startGrams: string
  targetGrams: string
  pressure: string
  pressureUnit: PressureReadingUnit
  ambientC: string
  cylinder: string
}

export type RechargePreview =
  | { state: 'waiting'; needs: string }
  | { state: 'problem'; message: string }
  | { state: 'ok'; progress: ChargingProgress; targetG: number }

type PreviewStage = Pick<UnitStageDto, 'refrigerant' | 'chargeG' | 'volumeL' | 'designPressureKpa'>

const number = (text: string): number | undefined => {
  const typed = parseDecimal(text)
  return typed.state === 'ok' ? typed.value : undefined
}

/** The live answer for the typed recharge fields on `stage`, gauges read against `atmosphericKpa`. */
export function rechargePreview(stage: PreviewStage, form: RechargeForm, atmosphericKpa: number): RechargePreview {
  const info = findRefrigerant(stage.refrigerant)
  if (!info) return { state: 'waiting', needs: `Rimecase has no data for ${stage.refrigerant}: weigh the charge in.` }
  if (!stage.volumeL) return { state: 'waiting', needs: 'The stage\'s internal volume is not on the unit\'s record, so pressure and grams cannot be turned into each other: weigh the charge in.' }
  const targetG = number(form.targetGrams) ?? stage.chargeG ?? undefined
  const ambientC = number(form.ambientC)
  if (!targetG || targetG <= 0) return { state: 'waiting', needs: 'Enter the charge the stage should hold.' }
  if (ambientC === undefined) return { state: 'waiting', needs: 'Enter the room temperature the stage stands at.' }
  const base = {
    designation: info.designation, volumeL: stage.volumeL, ambientC, targetChargeG: targetG, display: { unit: form.pressureUnit, atmosphericKpa },
    ...(stage.designPressureKpa ? { designPressureKpa: stage.designPressureKpa } : {}),
  }
  try {
    if (form.method === 'standing-pressure') {
      const pressure = number(form.pressure)
      if (pressure === undefined) return { state: 'waiting', needs: 'Enter the standing pressure read, settled.' }
      const pressureKpa = toKpaAbs(pressure, form.pressureUnit, atmosphericKpa)
      if (pressureKpa <= 0) return { state: 'problem', message: 'That is below a perfect vacuum: check the sign and the unit.' }
      return { state: 'ok', progress: chargingProgress(base, { by: 'pressure', pressureKpa }), targetG }
    }
    const grams = number(form.grams)
    if (grams === undefined || grams <= 0) return { state: 'waiting', needs: 'Enter the grams weighed in.' }
    const startG = number(form.startGrams) ?? 0
    if (startG < 0) return { state: 'problem', message: 'The grams already in cannot be negative.' }
    return { state: 'ok', progress: chargingProgress(base, { by: 'weight', addedG: grams, startG }), targetG }
  } catch (error) {
    return { state: 'problem', message: propertyProblem(error) }
  }
}
