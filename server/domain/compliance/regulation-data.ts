/**
 * The regulation data files (data/*.json) and their schemas. Limits, intervals, GWP tables and the
 * sources behind them live in those files, not in code: a jurisdiction or a regulation is added by
 * dropping a file into data/jurisdictions or data/f-gas and listing it in the two maps below (a unit
 * test fails when a file in those folders is not listed). Every file is checked against its schema
 * when this module loads, so a broken file stops the server at start-up with the file and field named.
 */
import { z } from 'zod'
import { APPLIANCE_TYPES, type SourceRef } from '#shared/types/compliance'
import { FieldNotFoundError } from '#server/domain/errors'
import { dayNumber } from './calendar'
import substancesFile from './data/substances.json'
import eu2014File from './data/f-gas/eu-2014.json'
import eu2024File from './data/f-gas/eu-2024.json'
import euFile from './data/jurisdictions/eu.json'
import gbFile from './data/jurisdictions/gb.json'
import usFederalFile from './data/jurisdictions/us-federal.json'

/** The F-gas regulation files by name, as they sit in data/f-gas; the registry test compares them with the folder. */
export const F_GAS_REGIME_FILES: Readonly<Record<string, unknown>> = { 'eu-2014.json': eu2014File, 'eu-2024.json': eu2024File }
/** The jurisdiction files by name, as they sit in data/jurisdictions; compared with the folder likewise. */
export const JURISDICTION_FILES: Readonly<Record<string, unknown>> = { 'us-federal.json': usFederalFile, 'eu.json': euFile, 'gb.json': gbFile }

const slug = z.string().regex(/^[a-z0-9-]+$/, 'a lower-case id such as us-federal')
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'a date as YYYY-MM-DD')
const status = z.enum(['regulation text', 'secondary', 'from memory', 'computed'])
const sourceSchema = z.object({ title: z.string().min(1), url: z.url().optional(), status }).strict()
const sourcesSchema = z.record(z.string(), sourceSchema)
const designation = z.string().regex(/^R\d+[A-Za-z]*$/, 'a designation such as R404A')
const componentsSchema = z.array(z.object({ designation, massPercent: z.number().positive().max(100) }).strict()).min(2)

/** Every `source` or `…Source` field of a file must name an entry of the file's own `sources`. */
function sourcesResolve(file: { sources: Record<string, unknown> }, ctx: z.RefinementCtx): void {
  const walk = (value: unknown, path: (string | number)[]): void => {
    if (Array.isArray(value)) value.forEach((v, i) => walk(v, [...path, i]))
    else if (value && typeof value === 'object') {
      for (const [k, v] of Object.entries(value)) {
        if (k === 'sources') continue
        if ((k === 'source' || k.endsWith('Source')) && typeof v === 'string') {
          if (!file.sources[v]) ctx.addIssue({ code: 'custom', path: [...path, k], message: `unknown source "${v}"` })
        } else walk(v, [...path, k])
      }
    }
  }
  walk(file, [])
}

/** How the US rules class a refrigerant: ozone-depleting class I or II, an HFC (or a blend with one), or another substitute. */
export const US_CLASSES = ['ods-class-i', 'ods-class-ii', 'hfc', 'substitute'] as const
export type UsClass = (typeof US_CLASSES)[number]

const substanceSchema = z
  .object({
    designation,
    name: z.string().min(1),
    usClass: z.enum(US_CLASSES),
    gwpAR4: z.number().nonnegative(),
    gwpSource: z.string(),
    classSource: z.string(),
    components: componentsSchema.optional(),
    note: z.string().optional(),
  })
  .strict()

/** data/substances.json: each refrigerant's US class and AR4 GWP, with sources. */
export const substancesFileSchema = z
  .object({ description: z.string(), sources: sourcesSchema, substances: z.array(substanceSchema).min(1) })
  .strict()
  .superRefine(sourcesResolve)

const fGasGasSchema = z
  .object({
    scope: z.enum(['annex-i', 'annex-ii', 'annex-ii-group-1', 'not-f-gas']),
    gwp: z.number().nonnegative().nullable(),
    source: z.string(),
    reason: z.string().optional(),
    components: componentsSchema.optional(),
  })
  .strict()

const tonnesBand = z.object({ fromTonnes: z.number().positive(), belowTonnes: z.number().positive().nullable(), months: z.number().int().positive(), monthsWithLeakDetection: z.number().int().positive() }).strict()
const kilogramBand = z.object({ fromKilograms: z.number().positive(), belowKilograms: z.number().positive().nullable(), months: z.number().int().positive(), monthsWithLeakDetection: z.number().int().positive() }).strict()

/** data/f-gas/*.json: one EU F-gas regulation's GWP table, scope and leak-check intervals. */
export const fGasRegimeSchema = z
  .object({
    id: slug,
    regulation: z.string().min(1),
    title: z.string().min(1),
    appliesFrom: isoDate,
    appliesUntil: isoDate.nullable(),
    gwpBasis: z.string(),
    sources: sourcesSchema,
    gases: z.record(designation, fGasGasSchema),
    leakChecks: z
      .object({
        citation: z.string(),
        source: z.string(),
        leakDetectionMonthsSource: z.string(),
        tonnesBands: z.array(tonnesBand).min(1),
        kilogramBands: z.array(kilogramBand),
        hermeticExemption: z.object({ citation: z.string(), belowTonnes: z.number().positive(), belowKilograms: z.number().positive().nullable(), source: z.string() }).strict(),
        leakDetectionRequired: z.object({ citation: z.string(), fromTonnes: z.number().positive(), fromKilograms: z.number().positive().nullable(), source: z.string() }).strict(),
        recheckAfterRepair: z.object({ citation: z.string(), withinMonths: z.number().int().positive(), notBeforeHours: z.number().nonnegative(), source: z.string() }).strict(),
      })
      .strict(),
  })
  .strict()
  .superRefine(sourcesResolve)

const applianceType = z.enum(APPLIANCE_TYPES)

const leakRateRuleSchema = z
  .object({
    id: slug,
    title: z.string().min(1),
    citation: z.string().min(1),
    source: z.string(),
    from: isoDate.nullable(),
    until: isoDate.nullable(),
    covers: z.object({ usClasses: z.array(z.enum(US_CLASSES)), substitutesAboveGwp: z.number().nonnegative().nullable() }).strict(),
    coverageNote: z.string().optional(),
    minFullChargeLb: z.number().positive(),
    excludedApplianceTypes: z.array(applianceType),
    thresholdsPercent: z.partialRecord(applianceType, z.number().positive().max(1000)),
    repair: z.object({ withinDays: z.number().int().positive(), withinDaysIfShutdown: z.number().int().positive(), source: z.string() }).strict(),
    leakInspections: z.array(
      z
        .object({
          applianceTypes: z.array(applianceType).min(1),
          fromFullChargeLb: z.number().positive(),
          belowFullChargeLb: z.number().positive().nullable(),
          everyMonths: z.number().int().positive(),
          untilMonthsBelowThreshold: z.number().int().positive(),
          source: z.string(),
        })
        .strict(),
    ),
    chronicLeak: z.object({ percentOfFullChargePerCalendarYear: z.number().positive(), reportByMonthDay: z.string().regex(/^\d{2}-\d{2}$/), source: z.string() }).strict().nullable(),
  })
  .strict()
  .superRefine((rule, ctx) => {
    for (const t of APPLIANCE_TYPES) {
      if (!rule.excludedApplianceTypes.includes(t) && rule.thresholdsPercent[t] === undefined) {
        ctx.addIssue({ code: 'custom', path: ['thresholdsPercent', t], message: `no limit for "${t}" and the type is not excluded` })
      }
    }
  })

/** data/jurisdictions/*.json: a jurisdiction's leak-rate rules and which F-gas regime applies when. */
export const jurisdictionSchema = z
  .object({
    id: slug,
    name: z.string().min(1),
    summary: z.string().min(1),
    sources: sourcesSchema,
    leakRate: z.object({ citation: z.string(), source: z.string(), firstAdditionDays: z.number().int().positive().max(365), firstAdditionSource: z.string() }).strict().nullable(),
    leakRateRules: z.array(leakRateRuleSchema),
    leakCheckRegimes: z.array(z.object({ regime: z.string(), from: isoDate, until: isoDate.nullable() }).strict()),
  })
  .strict()
  .superRefine(sourcesResolve)

export type SubstancesFile = z.infer<typeof substancesFileSchema>
export type Substance = SubstancesFile['substances'][number]
export type FGasRegime = z.infer<typeof fGasRegimeSchema>
export type FGasGas = FGasRegime['gases'][string]
export type Jurisdiction = z.infer<typeof jurisdictionSchema>
export type LeakRateRule = Jurisdiction['leakRateRules'][number]
export type Sources = z.infer<typeof sourcesSchema>

/** A data file that does not match its schema; the message names the file and the field. */
export class RegulationDataError extends Error {
  override name = 'RegulationDataError'
}

/** Parses one data file, naming `file` and the field at fault when it does not fit. */
export function parseDataFile<T>(file: string, schema: z.ZodType<T>, content: unknown): T {
  const result = schema.safeParse(content)
  if (result.success) return result.data
  const first = result.error.issues[0]!
  throw new RegulationDataError(`${file}: ${first.path.map(String).join('.') || '(root)'}: ${first.message}`)
}

function byId<T extends { id: string }>(files: Readonly<Record<string, unknown>>, schema: z.ZodType<T>, folder: string): Map<string, T> {
  const out = new Map<string, T>()
  for (const [name, content] of Object.entries(files)) {
    const parsed = parseDataFile(`${folder}/${name}`, schema, content)
    if (`${parsed.id}.json` !== name) throw new RegulationDataError(`${folder}/${name}: id "${parsed.id}" must match the file name`)
    out.set(parsed.id, parsed)
  }
  return out
}

/** The parsed data files, checked when this module loads. */
export const SUBSTANCES: SubstancesFile = parseDataFile('substances.json', substancesFileSchema, substancesFile)
export const F_GAS_REGIMES: ReadonlyMap<string, FGasRegime> = byId(F_GAS_REGIME_FILES, fGasRegimeSchema, 'f-gas')
export const JURISDICTIONS: ReadonlyMap<string, Jurisdiction> = byId(JURISDICTION_FILES, jurisdictionSchema, 'jurisdictions')

for (const j of JURISDICTIONS.values()) {
  for (const r of j.leakCheckRegimes) {
    if (!F_GAS_REGIMES.has(r.regime)) throw new RegulationDataError(`jurisdictions/${j.id}.json: leakCheckRegimes names unknown regime "${r.regime}"`)
  }
}

/** The source entry `key` of a file's `sources`, as the API shows it. */
export function sourceOf(sources: Sources, key: string): SourceRef {
  const s = sources[key]
  if (!s) throw new RegulationDataError(`unknown source "${key}"`)
  return { title: s.title, status: s.status, ...(s.url ? { url: s.url } : {}) }
}

/** The jurisdiction with this id; an unknown id is a not-found error on the `jurisdiction` field, listing the known ones. */
export function requireJurisdiction(id: string): Jurisdiction {
  const j = JURISDICTIONS.get(id)
  if (!j) throw new FieldNotFoundError(`Unknown jurisdiction "${id}"; known: ${[...JURISDICTIONS.keys()].join(', ')}`, 'jurisdiction')
  return j
}

/** True when `day` (a day number) lies within [from, until], either end open when null. */
export function inForce(period: { from: string | null; until: string | null }, day: number): boolean {
  return (period.from === null || dayNumber(period.from) <= day) && (period.until === null || day <= dayNumber(period.until))
}
