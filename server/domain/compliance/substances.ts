/**
 * Which refrigerants the compliance calculations know, and how a typed designation ("r-404a",
 * "R 23") is matched to one. A designation is known when the US class table or any EU F-gas table
 * lists it, so a gas added to one data file becomes usable without touching code.
 */
import { FieldNotFoundError } from '#server/domain/errors'
import { F_GAS_REGIMES, SUBSTANCES, type Substance } from './regulation-data'

function key(designation: string): string {
  return designation.trim().toUpperCase().replace(/^R[\s-]*/, 'R')
}

const CANONICAL = new Map<string, string>()
for (const s of SUBSTANCES.substances) CANONICAL.set(key(s.designation), s.designation)
for (const regime of F_GAS_REGIMES.values()) {
  for (const d of Object.keys(regime.gases)) if (!CANONICAL.has(key(d))) CANONICAL.set(key(d), d)
}
const BY_DESIGNATION = new Map(SUBSTANCES.substances.map((s) => [s.designation, s]))

/** The designation as the data files spell it, or undefined when no file lists it. */
export function canonicalDesignation(designation: string): string | undefined {
  return typeof designation === 'string' ? CANONICAL.get(key(designation)) : undefined
}

/** Like canonicalDesignation, but an unknown refrigerant is a not-found error tied to the `designation` field. */
export function requireDesignation(designation: string): string {
  const found = canonicalDesignation(designation)
  if (!found) throw new FieldNotFoundError(`Unknown refrigerant "${designation}": the compliance tables do not list it`, 'designation')
  return found
}

/** The US class and AR4 GWP of a refrigerant, when the substance table lists it. */
export function usSubstance(designation: string): Substance | undefined {
  const d = canonicalDesignation(designation)
  return d ? BY_DESIGNATION.get(d) : undefined
}

/** Every designation the compliance tables know, sorted. */
export function knownDesignations(): string[] {
  return [...new Set(CANONICAL.values())].sort()
}
