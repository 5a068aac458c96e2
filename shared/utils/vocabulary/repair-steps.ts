// Repair and verification steps in words: the step kinds, test gases, hot-work checks, recharge
// methods and verdicts as a technician, a customer and a regulator read them.
import type { HoldGas, HotWorkCheck, RechargeMethod, RepairStepKind, StepVerdict } from '#shared/types/repair-steps'
import type { ConfirmationBasis } from '#shared/types/cases'
import type { WordLabel } from './words'

export const REPAIR_STEP_WORDS: Readonly<Record<RepairStepKind, WordLabel>> = {
  'pressure-hold': { short: 'Pressure hold', long: 'Pressure hold with dry nitrogen' },
  evacuation: { short: 'Evacuation', long: 'Evacuation and vacuum decay' },
  'hot-work': { short: 'Brazing', long: 'Brazing or other hot work' },
  recharge: { short: 'Recharge', long: 'Recharge' },
}

export const HOLD_GAS_WORDS: Readonly<Record<HoldGas, string>> = {
  nitrogen: 'Dry nitrogen',
  'nitrogen-hydrogen': 'Nitrogen with 5 % hydrogen (trace gas)',
}

export const HOT_WORK_CHECK_WORDS: Readonly<Record<HotWorkCheck, string>> = {
  recovered: 'Refrigerant recovered from the stage into a rated cylinder',
  purgedWithNitrogen: 'Stage purged with dry nitrogen to push out what the refrigerant left',
  atmosphereChecked: 'Air around the work checked with a detector: no flammable atmosphere',
  permit: 'Hot-work permit in hand where the site or local codes require one',
  nitrogenFlowWhileBrazing: 'Dry nitrogen flowing through the pipe while brazing',
  extinguisher: 'Fire extinguisher at hand, flammable material moved or shielded',
}

export const RECHARGE_METHOD_WORDS: Readonly<Record<RechargeMethod, string>> = {
  scale: 'By weight on a scale',
  'standing-pressure': 'By standing pressure',
}

export const STEP_VERDICT_WORDS: Readonly<Record<StepVerdict, string>> = {
  pass: 'Passed',
  fail: 'Failed',
  done: 'Done',
  incomplete: 'Not finished',
}

export const CONFIRMATION_BASIS_WORDS: Readonly<Record<ConfirmationBasis, string>> = {
  test: 'settled by a definitive test',
  repair: 'settled by the repair that cured it',
  judgement: 'technician\'s judgement, not proven by a test',
}

/** "Pressure hold with dry nitrogen". */
export function repairStepLabel(kind: RepairStepKind, form: keyof WordLabel = 'long'): string {
  return REPAIR_STEP_WORDS[kind]?.[form] ?? String(kind)
}

/** The phases of a case's readings as the report groups them. */
export const READING_PHASE_WORDS = { diagnosis: 'As found', repair: 'After repair', verification: 'As left' } as const
