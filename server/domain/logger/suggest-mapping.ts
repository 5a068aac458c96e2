/**
 * A first guess at the column mapping from a logger file's header (and a few of its rows), for the
 * mapping step to show pre-filled: the technician confirms or corrects it, and it is remembered for
 * that logger model. Header words are matched in English and German, the languages of the loggers
 * met so far; units are read from the header ("°F", "[K]", "psig") or, for temperatures, from the values.
 */
import type { LoggerColumn, LoggerMappingInput } from '#shared/schemas/logger'
import { isStageQuantity } from '#shared/types/diagnosis'
import type { LoggerQuantity } from '#shared/types/logger'
import { splitUnit } from './cell-values'
import { headerKey } from './csv-text'

const TIME_WORDS = /^(date ?time|timestamp|time ?stamp|time|date|zeit|datum|uhrzeit|zeitstempel|datum ?zeit|elapsed|min(utes)?|sec(onds)?)\b/

const QUANTITY_WORDS: [RegExp, LoggerQuantity][] = [
  [/set ?point|soll/, 'setpointTemperature'],
  [/cascade|kaskade|\bhx\b|interstage|zwischen/, 'cascadeHxTemperature'],
  [/(^|[^a-zäöü])(ambient|room|raum|umgebung|outside|aussen|außen)/, 'ambientTemperature'],
  [/cond(enser)?.*(in|entering)|verfl.*ein/, 'condenserAirInTemperature'],
  [/cond(enser)?.*(out|leaving)|verfl.*aus/, 'condenserAirOutTemperature'],
  [/evap|verdampf/, 'evaporatorTemperature'],
  [/suction ?press|saugdruck|\blp\b/, 'suctionPressure'],
  [/discharge ?press|hochdruck|\bhp\b/, 'dischargePressure'],
  [/suction|saug/, 'suctionTemperature'],
  [/discharge|druckgas|heissgas|heißgas/, 'dischargeTemperature'],
  [/liquid|fl[uü]ssig/, 'liquidLineTemperature'],
  [/current|amps?\b|strom|\(a\)|\[a\]/, 'compressorCurrent'],
  [/compressor|verdichter|kompressor|run(ning)?\b|relay|relais/, 'compressorRunning'],
  [/cabinet|chamber|inside|interior|innen|kammer|box|freezer|cab\b|probe|t ?1\b|temp/, 'cabinetTemperature'],
]

const STAGE_WORDS: [RegExp, 'high' | 'low'][] = [
  [/\b(high|hs|ht|hoch|stage ?1|1st)\b/, 'high'],
  [/\b(low|ls|lt|nieder|stage ?2|2nd)\b/, 'low'],
]

function unitFromHeader(key: string): string | null {
  if (/°f|\[f\]|\(f\)|\bdeg ?f\b|fahrenheit/.test(key)) return 'F'
  if (/\[k\]|\(k\)|kelvin/.test(key)) return 'K'
  if (/°c|\[c\]|\(c\)|\bdeg ?c\b|celsius/.test(key)) return 'C'
  for (const u of ['psig', 'psia', 'barg', 'kpag', 'mpa', 'kpa', 'bar']) if (new RegExp(`\\b${u}\\b`).test(key)) return u === 'kpag' ? 'kPag' : u === 'kpa' ? 'kPa' : u === 'mpa' ? 'MPa' : u
  return null
}

export interface MappingSuggestion {
  mapping: LoggerMappingInput
  /** Header columns the suggestion left out. */
  unmapped: string[]
  /** What the technician should check before confirming. */
  notes: string[]
}

/** Suggests a mapping from the header cells and up to a few hundred sample rows (cells as text). */
export function suggestMapping(header: readonly string[], sampleRows: readonly (readonly string[])[] = [], defaultStage: 'single' | 'high' | 'low' = 'single'): MappingSuggestion {
  const keys = header.map(headerKey)
  const notes: string[] = []
  const timeIndex = Math.max(0, keys.findIndex((k) => TIME_WORDS.test(k)))
  if (!TIME_WORDS.test(keys[timeIndex] ?? '')) notes.push(`No column looks like a time; the first ("${header[0] ?? ''}") was taken.`)
  const todIndex = keys.findIndex((k, i) => i !== timeIndex && /^(time|uhrzeit|zeit)\b/.test(k) && /^(date|datum)\b/.test(keys[timeIndex]!))
  const used = new Set<string>()
  const columns: LoggerColumn[] = []
  const unmapped: string[] = []
  header.forEach((name, i) => {
    if (i === timeIndex || i === todIndex || !name.trim()) return
    const key = keys[i]!
    const quantity = QUANTITY_WORDS.find(([re]) => re.test(key))?.[1]
    const stage = STAGE_WORDS.find(([re]) => re.test(key))?.[1] ?? defaultStage
    const perStage = quantity !== undefined && isStageQuantity(quantity)
    const slot = `${quantity}|${perStage ? stage : ''}`
    if (!quantity || used.has(slot)) {
      unmapped.push(name)
      return
    }
    used.add(slot)
    let unit = quantity === 'compressorRunning' ? 'bool' : quantity === 'compressorCurrent' ? 'A' : unitFromHeader(key)
    if (!unit && (quantity === 'suctionPressure' || quantity === 'dischargePressure')) {
      unit = 'barg'
      notes.push(`"${name}": no pressure unit in the header; gauge bar assumed.`)
    }
    if (!unit) unit = sampleRows.map((r) => splitUnit(r[i] ?? '')?.unit).find((u) => u !== undefined && u !== 'a') ?? null
    if (!unit) {
      const values = sampleRows.map((r) => Number((r[i] ?? '').replace(',', '.'))).filter(Number.isFinite)
      // Cabinet and room temperatures in kelvin are all above about 150; in °C or °F mostly below 100.
      unit = values.length && values.every((v) => v > 150 && v < 400) ? 'K' : 'C'
      notes.push(`"${name}": no unit in the header; ${unit === 'K' ? 'kelvin' : '°C'} assumed from the values.`)
    }
    columns.push({ column: name, quantity, ...(perStage ? { stage } : {}), unit: unit as LoggerColumn['unit'] })
  })
  if (!columns.some((c) => c.quantity === 'cabinetTemperature')) notes.push('No cabinet temperature column found: the pull-down analysis needs one.')
  return {
    mapping: { time: { column: header[timeIndex] ?? 0, ...(todIndex >= 0 ? { timeOfDayColumn: header[todIndex]! } : {}) }, columns },
    unmapped,
    notes,
  }
}
