// Hostile request bodies for the write routes, made with fast-check: wrong types, huge numbers,
// number-like strings, deep nesting, prototype-pollution keys, NUL characters and lone surrogates,
// very long strings, arrays over the caps, and shapes drawn from a route's own zod schema with one
// value made hostile (or left valid with values at the schema's edges).
import fc from 'fast-check'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'

/** A body as it goes on the wire. */
export interface WireBody {
  what: string
  contentType: string
  body: string | FormData
}

type Schema = { _zod: { def: any } } & Record<string, any>

const HUGE_NUMBERS = [1e308, -1e308, Number.MAX_SAFE_INTEGER, Number.MAX_SAFE_INTEGER + 2, 2 ** 31, 2 ** 32 + 1, -(2 ** 63), 5e-324, -0, 0.1 + 0.2, 1.5, -1]
const NUMBER_STRINGS = ['NaN', 'Infinity', '-Infinity', '1e999', '0x1F', ' 12 ', '1,5', '', '12abc', '-0', '2147483648', '99999999999999999999']
const NASTY_TEXT = ['\u0000', 'a\u0000b', 'x\uD800y', '\uDFFF', '\uD83D', '\u202E\u0000', '\uFEFF', '../../etc/passwd', "'; DROP TABLE cases; --", '${7*7}', '{{7*7}}', '<img src=x onerror=alert(1)>', '%00', '\r\n\r\n', '\\u0000']
const PROTO_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'valueOf', 'hasOwnProperty']

const longText = fc.integer({ min: 4_001, max: 300_000 }).chain((n) => fc.constantFrom('x', 'é', '😀', '\u0000', ' ').map((c) => c.repeat(Math.ceil(n / c.length))))
const badText = fc.oneof(fc.string({ unit: 'binary', maxLength: 60 }), fc.constantFrom(...NASTY_TEXT), longText)

/** JSON text nested `depth` levels deep (arrays or objects). */
const deepJson = fc.record({ depth: fc.integer({ min: 64, max: 60_000 }), kind: fc.constantFrom('array', 'object') }).map(({ depth, kind }) =>
  kind === 'array' ? `${'['.repeat(depth)}1${']'.repeat(depth)}` : `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`)

/** A JSON text whose own keys pollute a prototype if the server merges it carelessly. */
const pollutingJson = fc.record({ key: fc.constantFrom(...PROTO_KEYS), inner: fc.constantFrom('{"polluted":true}', '{"prototype":{"polluted":true}}', '"x"', '1', 'null') })
  .map(({ key, inner }) => `{"${key}":${inner}}`)

/** Any single hostile value: the leaf put in place of a valid one. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(...HUGE_NUMBERS),
  fc.constantFrom(...NUMBER_STRINGS),
  badText,
  fc.constantFrom(null, true, false, 0, [], {}, [null], { '': '' }),
  fc.integer({ min: 501, max: 5_000 }).chain((n) => fc.constantFrom(1, 'x', { a: 1 }, null).map((item) => Array.from({ length: n }, () => item))),
  fc.integer({ min: 10, max: 400 }).map((depth) => JSON.parse(`${'['.repeat(depth)}${']'.repeat(depth)}`)),
  fc.constantFrom(...PROTO_KEYS).map((key) => JSON.parse(`{"${key}":{"polluted":true}}`)),
  fc.anything({ maxDepth: 3, maxKeys: 6, withNullPrototype: true, withBigInt: false, withDate: false, withMap: false, withSet: false, withTypedArray: false, withSparseArray: false }),
)

const lengthChecks = (s: Schema) => {
  let min = 0
  let max = Infinity
  for (const check of s._zod.def.checks ?? []) {
    const def = check._zod?.def
    if (def?.check === 'min_length') min = def.minimum
    if (def?.check === 'max_length') max = def.maximum
    if (def?.check === 'length_equals') min = max = def.length
  }
  return { min, max }
}

/**
 * Values of the shape `schema` describes, drawn towards its edges: strings at their length limits,
 * numbers at their bounds, optional keys present or not. Refinements are not followed, so some
 * values are still refused; that is fine: they are probes.
 */
export function fromSchema(schema: Schema | undefined, depth = 0): fc.Arbitrary<unknown> {
  const def = schema?._zod?.def
  if (!def || depth > 8) return fc.constant(null)
  const s = schema!
  switch (def.type) {
    case 'string': {
      const min = s.minLength ?? 0
      const max = Math.min(s.maxLength ?? 60, 5_000)
      const format = s.format as string | null
      if (format === 'email') return fc.emailAddress()
      if (format === 'uuid' || format === 'guid') return fc.uuid()
      if (format === 'datetime') return fc.date({ min: new Date('1970-01-01'), max: new Date('2200-01-01'), noInvalidDate: true }).map((d) => d.toISOString())
      if (format === 'date') return fc.date({ min: new Date('1970-01-01'), max: new Date('2200-01-01'), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10))
      const regex = (def.checks ?? []).map((c: any) => c._zod?.def).find((d: any) => d?.format === 'regex')?.pattern as RegExp | undefined
      if (regex) return fc.stringMatching(regex)
      return fc.oneof(
        fc.string({ minLength: min, maxLength: Math.min(max, 40) }),
        fc.constantFrom(max, Math.max(min, 1), Math.max(min - 1, 0), max + 1).chain((n) => fc.constantFrom('a', 'ß', '😀', ' ').map((c) => c.repeat(n))),
      )
    }
    case 'number': {
      const int = !!s.isInt
      const lo = Number.isFinite(s.minValue) ? s.minValue : int ? -(2 ** 31) : -1e9
      const hi = Number.isFinite(s.maxValue) ? s.maxValue : int ? 2 ** 31 - 1 : 1e9
      const edges = [lo, hi, 0, 1, -1].filter((n) => n >= lo && n <= hi)
      return fc.oneof(fc.constantFrom(...edges), int ? fc.integer({ min: Math.max(lo, -(2 ** 31)), max: Math.min(hi, 2 ** 31 - 1) }) : fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true }))
    }
    case 'bigint':
      return fc.integer()
    case 'boolean':
      return fc.boolean()
    case 'null':
      return fc.constant(null)
    case 'date':
      return fc.date({ noInvalidDate: true }).map((d) => d.toISOString())
    case 'enum':
      return fc.constantFrom(...Object.values(def.entries as Record<string, unknown>))
    case 'literal':
      return fc.constantFrom(...(def.values as unknown[]))
    case 'object': {
      const shape = def.shape as Record<string, Schema>
      const keys = Object.keys(shape)
      if (!keys.length) return fc.constant({})
      const required = keys.filter((k) => !['optional', 'default', 'prefault'].includes(shape[k]!._zod.def.type))
      return fc.record(Object.fromEntries(keys.map((k) => [k, fromSchema(shape[k], depth + 1)])), { requiredKeys: required })
    }
    case 'array': {
      const { min, max } = lengthChecks(s)
      return fc.array(fromSchema(def.element, depth + 1), { minLength: Math.min(min, 4), maxLength: Math.max(Math.min(min, 4), Math.min(max, 4)) })
    }
    case 'tuple':
      return fc.tuple(...(def.items as Schema[]).map((item) => fromSchema(item, depth + 1)))
    case 'record':
      return fc.dictionary(fc.string({ minLength: 1, maxLength: 12 }), fromSchema(def.valueType, depth + 1), { maxKeys: 3 })
    case 'union':
      return fc.oneof(...(def.options as Schema[]).map((o) => fromSchema(o, depth + 1)))
    case 'intersection':
      return fc.tuple(fromSchema(def.left, depth + 1), fromSchema(def.right, depth + 1)).map(([a, b]) => (isPlainObject(a) && isPlainObject(b) ? { ...a, ...b } : a))
    case 'optional':
      return fc.option(fromSchema(def.innerType, depth + 1), { nil: undefined, freq: 3 })
    case 'nullable':
      return fc.option(fromSchema(def.innerType, depth + 1), { nil: null, freq: 3 })
    case 'default':
    case 'prefault':
    case 'catch':
    case 'readonly':
    case 'nonoptional':
    case 'success':
      return fromSchema(def.innerType, depth + 1)
    case 'pipe':
      return fromSchema(def.in?._zod?.def.type === 'transform' ? def.out : def.in, depth + 1)
    case 'lazy':
      return depth > 4 ? fc.constant(null) : fromSchema(def.getter(), depth + 1)
    default:
      return fc.anything({ maxDepth: 1 })
  }
}

const isPlainObject = (v: unknown): v is Record<string, unknown> => !!v && typeof v === 'object' && !Array.isArray(v)

/** Every path to a leaf of `value` ([] for a leaf itself). */
function leafPaths(value: unknown, at: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(value)) return value.length ? value.flatMap((v, i) => leafPaths(v, [...at, i])) : [at]
  if (isPlainObject(value)) return Object.keys(value).length ? Object.entries(value).flatMap(([k, v]) => leafPaths(v, [...at, k])) : [at]
  return [at]
}

function replaceAt(value: unknown, path: (string | number)[], leaf: unknown): unknown {
  if (!path.length) return leaf
  const [head, ...rest] = path
  const copy: any = Array.isArray(value) ? [...value] : { ...(value as object) }
  copy[head!] = replaceAt(copy[head!], rest, leaf)
  return copy
}

const json = (what: string, value: unknown): WireBody => ({ what, contentType: 'application/json', body: JSON.stringify(value) ?? 'null' })
const raw = (what: string, body: string, contentType = 'application/json'): WireBody => ({ what, contentType, body })

/** Hostile JSON bodies for a route whose input `schema` describes (any JSON route when undefined). */
export function hostileJsonBodies(schema: Schema | undefined): fc.Arbitrary<WireBody> {
  const valid = schema ? fromSchema(schema) : fc.constant({})
  const keys = schema?._zod.def.type === 'object' ? Object.keys(schema._zod.def.shape) : ['text', 'name', 'id', 'value']
  return fc.oneof(
    // The route's own shape with one value, anywhere in it, made hostile.
    { weight: 5, arbitrary: fc.tuple(valid, fc.nat(), hostileValue).map(([body, n, leaf]) => {
      const paths = leafPaths(body)
      const path = paths[n % paths.length]!
      return json(`schema shape, ${path.join('.') || 'root'} replaced`, replaceAt(body, path, leaf))
    }) },
    // The route's own shape, values at the edges of what it allows.
    { weight: 2, arbitrary: valid.map((body) => json('schema shape at its edges', body)) },
    // Each of its fields given a wrong type.
    { weight: 2, arbitrary: fc.dictionary(fc.constantFrom(...keys), hostileValue, { minKeys: 1, maxKeys: keys.length }).map((body) => json('fields of wrong types', body)) },
    // Prototype-pollution keys next to the route's own fields.
    { weight: 1, arbitrary: fc.tuple(valid, pollutingJson).map(([body, polluting]) => {
      const text = JSON.stringify(isPlainObject(body) ? body : {})
      return raw('prototype keys', text === '{}' ? polluting : `${polluting.slice(0, -1)},${text.slice(1)}`)
    }) },
    // A body that is not an object at all.
    { weight: 1, arbitrary: hostileValue.map((v) => json('not an object', Array.isArray(v) || !isPlainObject(v) ? v : [v])) },
    // JSON text that JSON.stringify never makes: NaN, huge literals, deep nesting, broken syntax.
    { weight: 2, arbitrary: fc.oneof(
      deepJson,
      pollutingJson,
      fc.constantFrom(...keys).chain((k) => fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e999', '-1e999', '99999999999999999999999999', '1e-999', '0x10', "'x'", 'undefined').map((v) => `{"${k}":${v}}`)),
      fc.constantFrom('', ' ', '{', '{"a":', '[1,2', 'null', 'true', '"just a string"', '\uFEFF{}', '{"a":1}{"b":2}', '{"a":1,}', '{"\\u0000":1}', '{"a":"\\ud800"}', '{"a":"\\u0000"}', `{"a":1${',"a":2'.repeat(5000)}}`),
      fc.string({ unit: 'binary', maxLength: 200 }),
    ).map((text) => raw('malformed or unusual JSON text', text)) },
    // The right JSON sent under another content type.
    { weight: 1, arbitrary: fc.tuple(valid, fc.constantFrom('text/plain', 'application/x-www-form-urlencoded', 'application/xml', 'application/json; charset=utf-16', 'application/jsonx', ''))
      .map(([body, type]) => raw(`JSON as "${type}"`, JSON.stringify(body) ?? 'null', type)) },
  )
}

/** Hostile CSV bodies for a data-logger upload. */
export const hostileCsvBodies: fc.Arbitrary<WireBody> = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 2_000 }).map((text) => raw('binary text as CSV', text, 'text/csv')),
  fc.array(fc.array(fc.oneof(badText.filter((t) => t.length < 2_000), fc.constantFrom(...NUMBER_STRINGS), fc.double().map(String)), { minLength: 1, maxLength: 8 }), { minLength: 1, maxLength: 40 })
    .map((rows) => raw('hostile CSV cells', rows.map((r) => r.join(',')).join('\n'), 'text/csv')),
  fc.integer({ min: 1, max: 20_000 }).map((n) => raw('one very long header', `time,${'c,'.repeat(n)}\n1,2`, 'text/csv')),
  fc.constantFrom('', '\n\n\n', 'time,cabinet\n', '"unterminated,quote\n1,2', 'time,cabinet\n2026-13-45 99:99,-80\n', 'time;cabinet\n1;NaN\n2;Infinity\n').map((text) => raw('edge CSV', text, 'text/csv')),
  hostileJsonBodies(undefined),
)

/** Hostile multipart bodies for an upload route. */
export const hostileMultipartBodies: fc.Arbitrary<WireBody> = fc.oneof(
  fc.record({
    bytes: fc.uint8Array({ maxLength: 4_000 }),
    name: fc.oneof(badText.filter((t) => t.length < 5_000), fc.constantFrom('photo.png', '../../x.png', 'a.svg', '.png', 'CON', 'x'.repeat(300) + '.png')),
    type: fc.constantFrom('image/png', 'image/jpeg', 'image/svg+xml', 'text/html', 'application/pdf', 'application/octet-stream', ''),
    field: fc.constantFrom('file', 'files', '__proto__', ''),
    purpose: fc.option(fc.oneof(badText.filter((t) => t.length < 5_000), fc.constantFrom('nameplate', 'photo', 'document')), { nil: undefined }),
  }).map(({ bytes, name, type, field, purpose }) => {
    const form = new FormData()
    form.append(field, new Blob([bytes], { type }), name)
    if (purpose !== undefined) form.append('purpose', purpose)
    return { what: 'hostile multipart form', contentType: '', body: form }
  }),
  fc.string({ unit: 'binary', maxLength: 500 }).map((text) => raw('broken multipart', text, 'multipart/form-data; boundary=xyz')),
  hostileJsonBodies(undefined),
)

/** Bodies for a route that takes none: any body at all. */
export const hostileBodiesForNone: fc.Arbitrary<WireBody> = fc.oneof(hostileJsonBodies(undefined), hostileCsvBodies)

/**
 * The zod schema a route file reads its body with (`readBodyAs(event, Schema)`), imported from the
 * module the file imports it from; undefined when the file defines it itself.
 */
export async function routeBodySchema(root: string, file: string): Promise<Schema | undefined> {
  const source = readFileSync(join(root, file), 'utf8')
  const name = /readBodyAs\(\s*event\s*,\s*(\w+)/.exec(source)?.[1]
  if (!name) return undefined
  for (const match of source.matchAll(/import\s+(?:type\s+)?\{([^}]*)\}\s*from\s*'([^']+)'/g)) {
    const pairs = match[1]!.split(',').map((n) => n.trim().split(/\s+as\s+/)).filter((p) => p[0])
    const found = pairs.find((p) => (p[1] ?? p[0]) === name)
    if (!found) continue
    const module = (await import(/* @vite-ignore */ match[2]!)) as Record<string, Schema>
    return module[found[0]!]
  }
  return undefined
}
