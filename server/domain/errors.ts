// Small typed errors that domain code and services throw. server/utils/errors.ts maps each type to
// its HTTP status in one table; nothing else in the server decides a status.

import type { FieldErrors } from '#shared/utils/input-errors'

/** No signed-in, active user: sign in first. */
export class UnauthenticatedError extends Error {
  override name = 'UnauthenticatedError'
}
/** The record does not exist, or belongs to another organisation (both are 404). */
export class NotFoundError extends Error {
  override name = 'NotFoundError'
}
/** The caller may not do this. */
export class ForbiddenError extends Error {
  override name = 'ForbiddenError'
  /** Field messages when the refusal is about what a field holds (an address the sender may not use). */
  constructor(message: string, readonly fieldErrors?: FieldErrors) {
    super(message)
  }
}
/** The record changed since the caller read it, or its state refuses the change. */
export class ConflictError extends Error {
  override name = 'ConflictError'
}
/** The input is well-formed but describes an impossible or out-of-range state. */
export class InvalidStateError extends Error {
  override name = 'InvalidStateError'
}
/** The input is malformed, or names something the record does not have (a stage the unit lacks). */
export class BadInputError extends Error {
  override name = 'BadInputError'
  constructor(message: string, readonly fieldErrors?: FieldErrors) {
    super(message)
  }
}
/** The input is larger than allowed. */
export class TooLargeError extends Error {
  override name = 'TooLargeError'
}
/** The input's content is of a type that is not accepted. */
export class UnsupportedTypeError extends Error {
  override name = 'UnsupportedTypeError'
}
/** Something the request needs is not there yet or not reachable (no published knowledge base, file store down). */
export class UnavailableError extends Error {
  override name = 'UnavailableError'
}

/** A clash tied to one input field (a serial or name already in use), so a form can show it there. */
export class FieldConflictError extends ConflictError {
  constructor(message: string, readonly field: string) {
    super(message)
  }
}
/** A record referenced by one input field (a site, a customer) that is missing or not the caller's. */
export class FieldNotFoundError extends NotFoundError {
  constructor(message: string, readonly field: string) {
    super(message)
  }
}

/** Too many attempts: try again after `retryAfterS` seconds. */
export class RateLimitedError extends Error {
  override name = 'RateLimitedError'
  constructor(message: string, readonly retryAfterS: number) {
    super(message)
  }
}

/**
 * Well-formed input that cannot be physically true (a temperature below absolute zero), or that a
 * safety gate refuses (brazing on a flammable stage before the checklist is done): 422 with the
 * messages beside their fields. Nothing is saved.
 */
export class ImplausibleInputError extends InvalidStateError {
  constructor(message: string, readonly fieldErrors: FieldErrors) {
    super(message)
  }
}

/**
 * Readings that are possible but far outside what the unit is built for: 422 until the technician
 * confirms each with a reason (`confirmations`). Nothing is saved.
 */
export class ConfirmationNeededError extends InvalidStateError {
  constructor(message: string, readonly fieldErrors: FieldErrors, readonly confirmationNeeded: { index: number; message: string }[]) {
    super(message)
  }
}
