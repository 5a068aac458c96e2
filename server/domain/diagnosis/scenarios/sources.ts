/**
 * Sources of the fault signatures the scenarios are built on. The published tables give directions
 * (up, down, unchanged) of the residuals; the magnitudes are trade practice at a moderate severity.
 */

/** Rossi & Braun 1997, "A statistical, rule-based fault detection and diagnostic method for vapor compression air conditioners", HVAC&R Research 3(1): directional signature table (from memory). */
export const RB97 = (fault: string) => `Rossi & Braun 1997, HVAC&R Research 3(1), fault-signature table, ${fault} row (from memory)`

/** The same signature on the high stage of a cascade, with the cascade coupling (warm heat exchanger, low-stage head up) from trade practice. */
export const RB97_CASCADE = (fault: string) => `${RB97(fault)}; carried through the cascade heat exchanger to the low stage: common practice, no source`

/** Kim, Payne, Domanski & Hermes 2009, NIST single-fault tests of a heat pump in cooling mode (from memory). */
export const KIM = (fault: string) => `Kim, Payne, Domanski & Hermes 2009, NIST single-fault tests in cooling mode, ${fault} (from memory)`

/** Trade practice without a citable source. */
export const CP = (what: string) => `common practice, no source: ${what}`
