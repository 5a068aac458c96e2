/** How compliance figures read in sentences: a true minus, at most a few decimals, the unit beside. */

/** 1 lb in grams, exact by the definition of the avoirdupois pound. */
export const GRAMS_PER_POUND = 453.59237

/** A figure with at most `decimals` decimals, no trailing zeros and a true minus sign. */
export function figure(value: number, decimals = 2): string {
  const rounded = Number(value.toFixed(decimals))
  const text = Object.is(rounded, -0) ? '0' : String(rounded)
  return text.replace('-', '\u2212')
}

/** A charge in grams with its value in pounds, as US rules state sizes in pounds. */
export function gramsAndPounds(grams: number): string {
  return `${figure(grams, 0)} g (${figure(grams / GRAMS_PER_POUND, 2)} lb)`
}

/** Drops floating-point noise (0.15 * 100 = 15.000000000000002) without rounding real precision away. */
export function clean(value: number): number {
  return Number(value.toPrecision(12))
}
