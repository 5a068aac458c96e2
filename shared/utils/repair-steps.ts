// What a repair step asks of the technician before it starts: the cautions of its own kind, stage
// and refrigerant (never another stage's), and the checks before brazing. Shared by the step form,
// which shows them before anything is entered, and by the server, which judges the step.
import type { HotWorkCheck, RepairStepKind } from '#shared/types/repair-steps'
import { HOT_WORK_CHECKS } from '#shared/types/repair-steps'
import { chargingCautions } from '#shared/utils/charging'
import { findRefrigerant, isDesignation } from '#shared/utils/properties'

/** The cautions of one kind of step on one stage and refrigerant; never another stage's. */
export function stepCautions(kind: RepairStepKind, refrigerant: string | undefined): string[] {
  const info = refrigerant && isDesignation(refrigerant) ? findRefrigerant(refrigerant) : undefined
  const flammable = !!info?.flammable
  switch (kind) {
    case 'pressure-hold':
      return [
        'Pressurise with dry nitrogen from a cylinder through a regulator and a relief valve set at or below the test pressure; never oxygen, compressed air or a flame.',
        'Stay below the stage\'s design pressure and below the rating of every gauge, hose and component under test; isolate what is rated lower.',
        'Release the nitrogen to a ventilated place when done: in a small room it displaces the air you breathe.',
      ]
    case 'evacuation':
      return [
        'Never run a compressor under deep vacuum, and never use a compressor to pull the vacuum.',
        ...(flammable ? [`The stage held ${refrigerant}, which is flammable: vent the vacuum pump's exhaust outdoors and use a pump rated for flammable refrigerants.`] : []),
      ]
    case 'hot-work':
      return [
        ...(flammable
          ? [`This stage held ${refrigerant}, a flammable refrigerant (safety class ${info!.safetyClass}): recover it, purge the stage with dry nitrogen, check the air for a flammable atmosphere with a detector, and keep checking while you work.`]
          : []),
        'Braze with dry nitrogen flowing through the pipe; never braze on a system under pressure or with refrigerant in it.',
        'Follow the site\'s hot-work permit and local codes; keep an extinguisher at hand and shield or move what can burn.',
      ]
    case 'recharge':
      return info && refrigerant && isDesignation(refrigerant) ? [...chargingCautions(refrigerant), ...info.cautions] : []
  }
}

/** Checks required before brazing on a stage: all of them where it held a flammable refrigerant. */
export function requiredHotWorkChecks(refrigerant: string): HotWorkCheck[] {
  const flammable = isDesignation(refrigerant) && !!findRefrigerant(refrigerant)?.flammable
  return flammable ? [...HOT_WORK_CHECKS] : ['recovered', 'nitrogenFlowWhileBrazing', 'extinguisher']
}

