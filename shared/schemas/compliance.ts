/**
 * Inputs of the compliance calculations. The refrigerant-log forms will check the same fields with
 * these schemas, so a field error reads the same in the browser and from the API.
 */
import { z } from 'zod'
import { APPLIANCE_TYPES, F_GAS_BASES, LEAK_RATE_METHODS } from '#shared/types/compliance'

const number = (label: string) => z.number({ error: `${label} must be a number` }).finite(`${label} must be a finite number`)
const grams = (label: string) => number(label).nonnegative(`${label} cannot be negative`).max(1_000_000_000, `${label} must be at most 1 000 000 000 g`)
const fullCharge = number('Full charge (g)').positive('Full charge must be above 0 g').max(1_000_000_000, 'Full charge must be at most 1 000 000 000 g')
const enumOf = <const T extends readonly [string, ...string[]]>(label: string, words: T) =>
  z.enum(words, {
    error: (issue) => (issue.input === undefined ? `Give the ${label}: ${words.join(', ')}` : `Unknown ${label} ${JSON.stringify(issue.input)}; allowed: ${words.join(', ')}`),
  })

/** Optional context that turns a bare leak rate into a verdict against a jurisdiction's limit. */
const leakRateContext = {
  designation: z.string({ error: 'Give the refrigerant designation, e.g. R404A' }).trim().min(1, 'Give the refrigerant designation, e.g. R404A').max(20).optional(),
  applianceType: enumOf('appliance type', APPLIANCE_TYPES).optional(),
  jurisdiction: z.string({ error: 'Give a jurisdiction, e.g. us-federal' }).trim().regex(/^[a-z0-9-]{1,40}$/, 'A jurisdiction is a short id such as us-federal').optional(),
  date: z.iso.date({ error: 'Give the date of the addition as YYYY-MM-DD' }).optional(),
}

/**
 * `POST /api/calculations/leak-rate`: the annualizing method (`addedG`, `fullChargeG`,
 * `daysSinceLastAddition`) or the rolling-average method (`addedLast365DaysG`, `fullChargeG`).
 */
export const LeakRateBodySchema = z.discriminatedUnion(
  'method',
  [
    z.object({
      method: z.literal('annualizing'),
      addedG: grams('Refrigerant added (g)'),
      fullChargeG: fullCharge,
      daysSinceLastAddition: number('Days since refrigerant was last added').positive('Days since the last addition must be above 0 (combine additions made the same day)').max(36_500, 'Days since the last addition must be at most 36 500'),
      ...leakRateContext,
    }),
    z.object({
      method: z.literal('rolling-average'),
      addedLast365DaysG: grams('Refrigerant added over the past 365 days (g)'),
      fullChargeG: fullCharge,
      ...leakRateContext,
    }),
  ],
  { error: `Give the method: ${LEAK_RATE_METHODS.join(' or ')}` },
)
export type LeakRateRequest = z.infer<typeof LeakRateBodySchema>

/** `POST /api/calculations/co2e`: one charge under the 2014 or the 2024 EU F-gas regulation. */
export const Co2eBodySchema = z.object({
  designation: z.string({ error: 'Give the refrigerant designation, e.g. R404A' }).trim().min(1, 'Give the refrigerant designation, e.g. R404A').max(20),
  chargeG: grams('Charge (g)'),
  basis: enumOf('basis', F_GAS_BASES),
  hermeticallySealed: z.boolean({ error: 'hermeticallySealed must be true or false' }).optional(),
  leakDetectionSystem: z.boolean({ error: 'leakDetectionSystem must be true or false' }).optional(),
})
export type Co2eRequest = z.infer<typeof Co2eBodySchema>
