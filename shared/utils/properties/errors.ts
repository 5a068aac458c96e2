/** Errors thrown by the property module. Messages are written for the technician who typed the input. */

/** The designation is not one of the refrigerants this module knows. */
export class UnknownRefrigerantError extends Error {
  constructor(designation: string, known: readonly string[]) {
    super(`Unknown refrigerant "${designation}". Known: ${known.join(', ')}.`)
    this.name = 'UnknownRefrigerantError'
  }
}

/** An input lies outside the range where the property model is valid (or physically possible). */
export class OutOfRangeError extends Error {
  range?: { minC: number; maxC: number; minKpa?: number; maxKpa?: number }
  /** The input field at fault, when one is (so a form can show the message beside it). */
  field?: string

  constructor(message: string, range?: { minC: number; maxC: number; minKpa?: number; maxKpa?: number }, field?: string) {
    super(message)
    this.name = 'OutOfRangeError'
    if (range) this.range = range
    if (field) this.field = field
  }
}

/** Unknown unit or a non-finite value. */
export class UnitError extends Error {
  allowed: readonly string[]

  constructor(message: string, allowed: readonly string[]) {
    super(message)
    this.name = 'UnitError'
    this.allowed = allowed
  }
}

/** °C with one decimal, for messages. */
export const fmtC = (c: number): string => `${c.toFixed(1)} °C`

/** kPa with sensible precision, for messages. */
export const fmtKpa = (p: number): string => `${p >= 1000 ? p.toFixed(1) : p >= 1 ? p.toPrecision(5) : p.toPrecision(3)} kPa`
