/**
 * zod 4 schemas for the rank request. Enums are strict and their messages list the allowed words,
 * because the API layer passes zod messages straight into its 400 response.
 */
import { z } from 'zod'
import {
  CASE_PHASES,
  CAUSES,
  DIMENSION_UNITS,
  METERING_DEVICES,
  QUANTITIES,
  QUANTITY_DIMENSION,
  READING_UNITS,
  STAGES,
  SYMPTOMS,
  TESTS,
  UNIT_KINDS,
  isStageQuantity,
  type Stage,
  type UnitKind,
} from '#shared/types/diagnosis'

/** A strict enum whose failure message names the bad word and every allowed one. */
export function wordEnum<const T extends readonly [string, ...string[]]>(label: string, words: T) {
  return z.enum(words, {
    error: (issue) => `Unknown ${label} ${JSON.stringify(issue.input)}; allowed: ${words.join(', ')}`,
  })
}

export const unitKindSchema = wordEnum('unit kind', UNIT_KINDS)
export const stageSchema = wordEnum('stage', STAGES)
export const quantitySchema = wordEnum('quantity', QUANTITIES)
export const symptomSchema = wordEnum('symptom', SYMPTOMS)
export const causeSchema = wordEnum('cause', CAUSES)
export const testSlugSchema = wordEnum('test', TESTS)
export const readingUnitSchema = wordEnum('unit', READING_UNITS)
export const casePhaseSchema = wordEnum('phase', CASE_PHASES)
export const meteringDeviceSchema = wordEnum('metering device', METERING_DEVICES)

const finite = z.number().finite()
const positive = finite.positive()

export const stageConfigSchema = z
  .object({
    stage: stageSchema,
    refrigerant: z.string().min(1).max(20),
    chargeG: positive.optional(),
    volumeL: positive.optional(),
    referenceStandingPressureKpa: positive.optional(),
    referenceAmbientC: finite.optional(),
    ratedCurrentA: positive.optional(),
    meteringDevice: meteringDeviceSchema.optional(),
  })
  .strict()

/** Which circuits each kind of unit has; a cascade has both, a single-stage unit only `single`. */
export const STAGES_OF_KIND: Readonly<Record<UnitKind, readonly Stage[]>> = {
  cascade: ['high', 'low'],
  'single-stage': ['single'],
}

export const unitConfigSchema = z
  .object({
    kind: unitKindSchema,
    stages: z.array(stageConfigSchema).min(1).max(2, 'A unit has at most two stages'),
    design: z.object({ cabinetC: finite.optional(), cascadeHxC: finite.optional() }).strict().optional(),
  })
  .strict()
  .superRefine((unit, ctx) => {
    const allowed = STAGES_OF_KIND[unit.kind]
    const seen = new Set<Stage>()
    unit.stages.forEach((s, i) => {
      if (!allowed.includes(s.stage)) {
        ctx.addIssue({
          code: 'custom',
          path: ['stages', i, 'stage'],
          message: `Stage "${s.stage}" does not belong to a ${unit.kind} unit; allowed: ${allowed.join(', ')}`,
        })
      }
      if (seen.has(s.stage)) {
        ctx.addIssue({ code: 'custom', path: ['stages', i, 'stage'], message: `Stage "${s.stage}" is listed twice` })
      }
      seen.add(s.stage)
    })
    for (const stage of allowed) {
      if (!seen.has(stage)) {
        ctx.addIssue({ code: 'custom', path: ['stages'], message: `A ${unit.kind} unit needs a "${stage}" stage` })
      }
    }
  })

export const readingSchema = z
  .object({
    quantity: quantitySchema,
    stage: stageSchema.optional(),
    value: z.union([finite, z.boolean()]),
    unit: readingUnitSchema,
    phase: casePhaseSchema.optional(),
  })
  .strict()
  .superRefine((r, ctx) => {
    const dimension = QUANTITY_DIMENSION[r.quantity]
    const units = DIMENSION_UNITS[dimension]
    if (!units.includes(r.unit)) {
      ctx.addIssue({
        code: 'custom',
        path: ['unit'],
        message: `Unit "${r.unit}" does not fit ${r.quantity}; allowed: ${units.join(', ')}`,
      })
    }
    const wantsBool = dimension === 'bool'
    if (wantsBool !== (typeof r.value === 'boolean')) {
      ctx.addIssue({
        code: 'custom',
        path: ['value'],
        message: wantsBool ? `${r.quantity} takes value true or false` : `${r.quantity} takes a number`,
      })
    }
    if (isStageQuantity(r.quantity) && r.stage === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['stage'],
        message: `${r.quantity} is measured per stage; give "stage" (${STAGES.join(', ')})`,
      })
    }
    if (!isStageQuantity(r.quantity) && r.stage !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['stage'], message: `${r.quantity} is unit-wide; omit "stage"` })
    }
  })

export const testResultSchema = z
  .object({
    test: testSlugSchema,
    stage: stageSchema.optional(),
    // Outcome words belong to each test of the knowledge base, so they are checked at ranking time.
    outcome: z.string().min(1),
    phase: casePhaseSchema.optional(),
  })
  .strict()

/** Caps on what one ranking request may carry: far above any real case, low enough to bound the work. */
export const MAX_READINGS = 500
export const MAX_TEST_RESULTS = 200
export const MAX_SYMPTOMS = 50

export const rankRequestSchema = z
  .object({
    unit: unitConfigSchema,
    site: z
      .object({
        altitudeM: z.number().min(-430, 'Altitude must be at least -430 m').max(5000, 'Altitude must be at most 5000 m').optional(),
        atmosphericKpa: z.number().min(50, 'Atmospheric pressure must be 50–110 kPa').max(110, 'Atmospheric pressure must be 50–110 kPa').optional(),
      })
      .strict()
      .optional(),
    symptoms: z.array(symptomSchema).max(MAX_SYMPTOMS, `At most ${MAX_SYMPTOMS} symptoms`).optional(),
    readings: z.array(readingSchema).max(MAX_READINGS, `At most ${MAX_READINGS} readings a request`).optional(),
    testResults: z.array(testResultSchema).max(MAX_TEST_RESULTS, `At most ${MAX_TEST_RESULTS} test results a request`).optional(),
  })
  .strict()
  .superRefine((req, ctx) => {
    const stages = new Set(req.unit.stages.map((s) => s.stage))
    const check = (stage: Stage | undefined, path: (string | number)[]) => {
      if (stage !== undefined && !stages.has(stage)) {
        ctx.addIssue({
          code: 'custom',
          path,
          message: `Stage "${stage}" is not a stage of this unit; allowed: ${[...stages].join(', ')}`,
        })
      }
    }
    req.readings?.forEach((r, i) => check(r.stage, ['readings', i, 'stage']))
    req.testResults?.forEach((t, i) => check(t.stage, ['testResults', i, 'stage']))
  })

export type RankRequestInput = z.input<typeof rankRequestSchema>

/** One line per zod issue, `path: message`, for the API layer's 400 body. */
export function formatZodIssues(error: z.ZodError): string[] {
  return error.issues.map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message))
}
