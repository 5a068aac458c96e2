import { z } from 'zod'
import { PRESSURE_READING_UNITS, TEMPERATURE_READING_UNITS } from '#shared/types/diagnosis'
import { HOLD_GASES, HOT_WORK_CHECKS, RECHARGE_METHODS } from '#shared/types/repair-steps'
import { VACUUM_UNITS } from '#shared/utils/properties'
import { stageSchema, wordEnum } from './diagnosis'

const version = z.number().int().nonnegative().optional()
const figure = (what: string) => z.number({ error: `${what} must be a number` }).finite()
const note = z.string().trim().max(2000, 'Keep it under 2000 characters').optional()
const minutes = (what: string) => figure(what).positive(`${what} must be more than 0 minutes`).max(10_080, `${what} must be at most a week (10 080 min)`)

const pressureHold = z.object({
  kind: z.literal('pressure-hold'),
  stage: stageSchema,
  gas: wordEnum('test gas', HOLD_GASES),
  pressureUnit: wordEnum('pressure unit', PRESSURE_READING_UNITS),
  testPressure: figure('Test pressure'),
  startPressure: figure('Start pressure'),
  endPressure: figure('End pressure'),
  temperatureUnit: wordEnum('temperature unit', TEMPERATURE_READING_UNITS),
  startTemperature: figure('Start temperature'),
  endTemperature: figure('End temperature'),
  holdMinutes: minutes('Hold time'),
  note,
}).strict()

const evacuation = z.object({
  kind: z.literal('evacuation'),
  stage: stageSchema,
  vacuumUnit: wordEnum('vacuum unit', VACUUM_UNITS),
  target: figure('Target vacuum').nonnegative('The target vacuum cannot be below 0'),
  reached: figure('Vacuum reached').nonnegative('The vacuum reached cannot be below 0'),
  decayMinutes: minutes('Decay time'),
  afterDecay: figure('Vacuum after the decay time').nonnegative('The vacuum after the decay time cannot be below 0'),
  note,
}).strict()

const hotWork = z.object({
  kind: z.literal('hot-work'),
  stage: stageSchema,
  task: z.string().trim().min(3, 'Say what was brazed or cut').max(300, 'Keep it under 300 characters'),
  checklist: z.object(Object.fromEntries(HOT_WORK_CHECKS.map((c) => [c, z.boolean().default(false)])) as Record<(typeof HOT_WORK_CHECKS)[number], z.ZodDefault<z.ZodBoolean>>).strict(),
  note,
}).strict()

const recharge = z.object({
  kind: z.literal('recharge'),
  stage: stageSchema,
  method: wordEnum('recharge method', RECHARGE_METHODS),
  refrigerant: z.string().trim().min(2).max(12).optional(),
  grams: figure('Grams').positive('Grams must be more than 0').max(500_000, 'That is more than any unit holds').optional(),
  startGrams: figure('Grams already in').nonnegative('Grams already in cannot be negative').max(500_000, 'That is more than any unit holds').optional(),
  targetGrams: figure('Target grams').positive('The target must be more than 0 g').max(500_000, 'That is more than any unit holds').optional(),
  pressure: figure('Standing pressure').optional(),
  pressureUnit: wordEnum('pressure unit', PRESSURE_READING_UNITS).optional(),
  ambientC: figure('Room temperature').min(-40, 'Room temperature must be at least −40 °C').max(60, 'Room temperature must be at most 60 °C').optional(),
  cylinder: z.string().trim().max(80).optional(),
  note,
}).strict()

/** `POST /api/cases/{id}/steps`: one repair or verification step with its figures. */
export const RepairStepSchema = z.discriminatedUnion('kind', [pressureHold, evacuation, hotWork, recharge], {
  error: () => 'kind must be one of: pressure-hold, evacuation, hot-work, recharge',
})
export const AddRepairStepSchema = z.object({ step: RepairStepSchema, version }).strict()
export type AddRepairStepInput = z.infer<typeof AddRepairStepSchema>
