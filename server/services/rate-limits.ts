// How often people may try things that an attacker would repeat: failed sign-ins (per address and
// per account), report e-mails and account changes. Counters live in PostgreSQL.
import { clearPoints, secondsToWait, takePoint, type RatePolicy } from '#server/db/repositories/rate-limits'
import { RateLimitedError } from '#server/domain/errors'

export const RATE_POLICIES = {
  /** Failed sign-ins from one network address. */
  signInAddress: { name: 'sign-in-address', points: 30, durationS: 15 * 60, blockS: 15 * 60 },
  /** Failed sign-ins to one account (e-mail), from anywhere. */
  signInAccount: { name: 'sign-in-account', points: 10, durationS: 15 * 60, blockS: 15 * 60 },
  /** Report e-mails sent or retried by one person. */
  reportSend: { name: 'report-send', points: 20, durationS: 60 * 60 },
  /** Account changes (users created or changed, passwords) by one person. */
  account: { name: 'account', points: 30, durationS: 10 * 60 },
} as const satisfies Record<string, RatePolicy>

export type RatePolicyName = keyof typeof RATE_POLICIES

const inWords = (s: number) => (s < 90 ? `${s} seconds` : `${Math.ceil(s / 60)} minutes`)

/** Counts one use by `key` under the named policy; throws RateLimitedError (429 with Retry-After) when over it. */
export async function spend(policy: RatePolicyName, key: string): Promise<void> {
  const wait = await takePoint(RATE_POLICIES[policy], key)
  if (wait) throw new RateLimitedError(`Too many requests. Try again in ${inWords(wait)}.`, wait)
}

/** Refuses a sign-in while the address or the account is over its failure limit. */
export async function assertSignInAllowed(address: string, email: string): Promise<void> {
  const wait = Math.max(await secondsToWait(RATE_POLICIES.signInAddress, address), await secondsToWait(RATE_POLICIES.signInAccount, email))
  if (wait) throw new RateLimitedError(`Too many failed sign-ins. Try again in ${inWords(wait)}.`, wait)
}

/** Counts a failed sign-in against the address and the account. */
export async function countFailedSignIn(address: string, email: string): Promise<void> {
  await Promise.all([takePoint(RATE_POLICIES.signInAddress, address), takePoint(RATE_POLICIES.signInAccount, email)])
}

/** A successful sign-in clears the account's failures. */
export async function clearFailedSignIns(email: string): Promise<void> {
  await clearPoints(RATE_POLICIES.signInAccount, email)
}
