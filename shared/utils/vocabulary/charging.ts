// Words of charge planning: what the phase of a standing charge means, and the bases a substitute
// charge can be planned on.
import type { SubstitutionBasis } from '#shared/utils/charging'
import { ABOVE_CRITICAL_AT_AMBIENT, type StandingPhase } from '#shared/utils/properties'

/** What the phase of a standing charge means for the technician, one line each. */
export const STANDING_PHASE_WORDS: Readonly<Record<StandingPhase, string>> = {
  gas: 'All gas: the standing pressure measures the charge',
  'two-phase': 'Liquid present (two-phase): the pressure is the saturation pressure',
  liquid: 'LIQUID-FULL: compressed liquid fills the stage',
  supercritical: ABOVE_CRITICAL_AT_AMBIENT.charAt(0).toUpperCase() + ABOVE_CRITICAL_AT_AMBIENT.slice(1),
}

/** The three ways of planning a substitute charge, as headings. */
export const SUBSTITUTION_BASIS_WORDS: Readonly<Record<SubstitutionBasis, string>> = {
  'standing-pressure': 'Same standing pressure',
  mass: 'Same mass',
  'liquid-volume': 'Same liquid volume',
}

/** How a new fill of a stage was planned, as the nameplate history says it. */
export const NAMEPLATE_BASIS_WORDS: Readonly<Record<'standing-pressure' | 'mass' | 'liquid-volume' | 'as-found', string>> = {
  'standing-pressure': 'Planned for the same standing pressure',
  mass: 'Planned for the same mass',
  'liquid-volume': 'Planned for the same liquid volume',
  'as-found': 'Found on site (not planned here)',
}
