/**
 * Streams a data-logger CSV (a Node stream of bytes) through papaparse into fixed-size summaries, so a
 * file of any length is processed in bounded memory: the chart series (downsampled), each column's
 * figures, the pull-down analysis, and the readings and symptoms offered to a case. Bad cells and rows
 * are reported with their row and column and skipped; the rest of the file still counts.
 *
 * The first 64 KB are read ahead to settle the format (encoding, delimiter, header row, decimal mark,
 * time format) unless the mapping fixes it. Progress is reported through `onProgress`, so a background
 * job can show a bar; an AbortSignal stops the work.
 */
import { Readable } from 'node:stream'
import Papa from 'papaparse'
import { LoggerMappingSchema, type ColumnRef, type LoggerMapping, type LoggerMappingInput } from '#shared/schemas/logger'
import type { LoggerAnalysis, LoggerRowError, LoggerSeries, OfferedReading, TimeFormat } from '#shared/types/logger'
import type { Quantity, ReadingUnit, Stage } from '#shared/types/diagnosis'
import { isStageQuantity } from '#shared/types/diagnosis'
import { toKpaAbs } from '#shared/utils/properties'
import { BadInputError } from '#server/domain/errors'
import { guessTimeFormat, isElapsed, readNumber, readState, splitUnit, timeReader, type Cell } from './cell-values'
import { completeLines, detectDecimal, detectDelimiter, findHeaderRow, headerKey, readAhead, type Delimiter, type ReadAhead } from './csv-text'
import { analysePullDown } from './pulldown-analysis'
import { TimeBuckets } from './time-buckets'

export interface LoggerProgress {
  bytesRead: number
  totalBytes: number | null
  /** 0–1 when the size is known, else null. */
  fraction: number | null
  rows: number
}

export interface ProcessOptions {
  /** File size, for the progress fraction. */
  totalBytes?: number
  /** Called at most once per percent (or per 50 000 rows when the size is unknown). */
  onProgress?: (p: LoggerProgress) => void
  signal?: AbortSignal
  /** The unit's design cabinet temperature, used as the setpoint when neither the mapping nor a column gives one. */
  unitSetpointC?: number
  /** Row errors listed in full (all are counted); default 100. */
  maxErrors?: number
  /** Points per chart series (even); default 1024. */
  chartPoints?: number
  /** Evenly spaced points the pull-down analysis works on (even); default 16 384. */
  analysisPoints?: number
}

const SHORT_CYCLE_MS = 5 * 60_000 // an on-time under 5 min is a short cycle (common practice, no source)
/** Share of data rows with errors above which the file is treated as not analysable. */
const MAX_ERROR_SHARE = 0.2

type Kind = 'temperature' | 'pressure' | 'current' | 'state' | 'number'

interface ResolvedColumn {
  index: number
  name: string
  quantity: LoggerSeries['quantity']
  stage: Stage | null
  label: string
  kind: Kind
  unit: string
  read: (text: string) => Cell<number | null>
}

function kindOf(unit: string): Kind {
  if (unit === 'C' || unit === 'F' || unit === 'K') return 'temperature'
  if (unit === 'bool') return 'state'
  if (unit === 'A') return 'current'
  if (unit === 'none') return 'number'
  return 'pressure'
}

function reader(kind: Kind, unit: string, decimal: '.' | ','): (text: string) => Cell<number | null> {
  if (kind === 'state') return readState
  return (text) => {
    let cell = readNumber(text, decimal)
    if (!cell.ok) {
      // Some loggers write the unit into every cell; it must agree with the mapping.
      const split = splitUnit(text)
      if (split) {
        if (split.unit !== unit && !(kind === 'current' && split.unit === 'A')) return { ok: false, reason: `"${text.trim()}" is in ${split.unit}, but the mapping says ${unit}` }
        cell = readNumber(split.number, decimal)
      }
    }
    if (!cell.ok || cell.value === null) return cell
    const v = cell.value
    if (kind === 'temperature') {
      const c = unit === 'C' ? v : unit === 'F' ? ((v - 32) * 5) / 9 : v - 273.15
      if (c < -273.15) return { ok: false, reason: `${text.trim()} ${unit === 'C' ? '°C' : unit === 'F' ? '°F' : 'K'} is below absolute zero` }
      if (c > 1000) return { ok: false, reason: `${text.trim()} is not a plausible temperature` }
      return { ok: true, value: c }
    }
    if (kind === 'pressure') {
      try {
        return { ok: true, value: toKpaAbs(v, unit) }
      } catch (error) {
        return { ok: false, reason: error instanceof Error ? error.message : 'not a pressure' }
      }
    }
    if (kind === 'current' && v < 0) return { ok: false, reason: `${text.trim()} A is a negative current` }
    return { ok: true, value: v }
  }
}

function seriesUnit(kind: Kind, unit: string): string {
  return kind === 'temperature' ? 'C' : kind === 'pressure' ? 'kPa' : kind === 'state' ? 'bool' : unit === 'none' ? '' : unit
}

class FailedFile extends Error {}

function emptyAnalysis(failure: string, format: LoggerAnalysis['format'], warnings: string[] = []): LoggerAnalysis {
  return {
    status: 'failed',
    failure,
    rows: { total: 0, data: 0, valid: 0, withErrors: 0, empty: 0 },
    errors: [],
    warnings,
    format,
    timeBase: 'absolute',
    span: null,
    chartBucketSeconds: 0,
    analysisResolutionSeconds: 0,
    series: [],
    setpointC: null,
    setpointSource: null,
    pullDowns: [],
    stalls: [],
    warmUps: [],
    compressor: null,
    offered: { readings: [], symptoms: [] },
  }
}

function abortError(): Error {
  return new DOMException('The logger file processing was cancelled', 'AbortError')
}

/** Reads and analyses a logger CSV; resolves to the analysis, with status `failed` when the file cannot be read. */
export async function processLoggerCsv(input: Readable, mappingInput: LoggerMapping | LoggerMappingInput, options: ProcessOptions = {}): Promise<LoggerAnalysis> {
  const parsed = LoggerMappingSchema.safeParse(mappingInput)
  if (!parsed.success) throw new BadInputError(`Column mapping: ${parsed.error.issues[0]?.path.join('.')}: ${parsed.error.issues[0]?.message}`)
  const mapping = parsed.data
  const signal = options.signal
  if (signal?.aborted) throw abortError()
  const format: LoggerAnalysis['format'] = { encoding: 'utf-8', delimiter: ',', decimal: '.', headerRow: null, timeFormat: mapping.time.format, columns: [] }
  let ahead: ReadAhead
  try {
    ahead = await readAhead(input)
  } catch (error) {
    if (error instanceof BadInputError) return emptyAnalysis(error.message, format)
    throw error
  }
  const { decoder, sample, ended } = ahead
  const it = ahead.rest
  format.encoding = decoder.encoding ?? 'utf-8'
  if (!sample.trim()) return emptyAnalysis('The file is empty.', format)

  let setup: ReturnType<typeof settle>
  try {
    setup = settle(sample, ended, mapping, format)
  } catch (error) {
    if (error instanceof FailedFile) return emptyAnalysis(error.message, format)
    throw error
  }
  const rest = Readable.from(
    (async function* () {
      yield sample
      if (ended) return
      for (;;) {
        const r = await it.next()
        if (r.done) return
        yield r.value
      }
    })(),
  )
  const state = new RowState(mapping, setup, options)
  await new Promise<void>((resolve, reject) => {
    const onAbort = () => {
      rest.destroy()
      input.destroy()
      reject(abortError())
    }
    signal?.addEventListener('abort', onAbort, { once: true })
    rest.on('error', (e) => reject(e))
    Papa.parse<string[]>(rest, {
      delimiter: setup.delimiter,
      skipEmptyLines: false,
      chunk: (results, parser) => {
        if (signal?.aborted) {
          parser.abort()
          return
        }
        state.addPapaErrors(results.errors)
        state.addRows(results.data)
        state.progress(decoder.bytesRead)
      },
      complete: () => {
        signal?.removeEventListener('abort', onAbort)
        if (signal?.aborted) reject(abortError())
        else resolve()
      },
      error: (e: Error) => reject(e),
    })
  })
  return state.finish(format)
}

interface Settled {
  delimiter: Delimiter
  decimal: '.' | ','
  headerIndex: number
  dataStart: number
  timeFormat: Exclude<TimeFormat, 'auto'>
  timeAssumption: string | null
  timeIndex: number
  timeName: string
  todIndex: number | null
  columns: ResolvedColumn[]
}

function settle(sample: string, ended: boolean, mapping: LoggerMapping, format: LoggerAnalysis['format']): Settled {
  const { text: cut, lines } = completeLines({ sample, ended })
  const delimiter = mapping.delimiter === 'auto' ? detectDelimiter(lines) : mapping.delimiter
  format.delimiter = delimiter
  const rows = Papa.parse<string[]>(cut, { delimiter, skipEmptyLines: false }).data
  const refs: ColumnRef[] = [mapping.time.column, ...(mapping.time.timeOfDayColumn !== undefined ? [mapping.time.timeOfDayColumn] : []), ...mapping.columns.map((c) => c.column)]
  const names = refs.filter((r): r is string => typeof r === 'string')
  let headerIndex = -1
  let dataStart = 0
  let header: string[] = []
  if (mapping.hasHeader) {
    headerIndex = mapping.headerRow !== undefined ? mapping.headerRow - 1 : findHeaderRow(rows, names)
    if (headerIndex < 0 || headerIndex >= rows.length) {
      const seen = rows.find((r) => r.filter((c) => c.trim()).length >= 2)
      throw new FailedFile(
        mapping.headerRow !== undefined
          ? `Line ${mapping.headerRow} (the header row of the mapping) is beyond the first part of the file.`
          : `No header row with the columns ${names.map((n) => `"${n}"`).join(', ')} in the first ${rows.length} lines.${seen ? ` The first row with columns reads: ${seen.map((c) => `"${c.trim()}"`).join(', ')}.` : ''}`,
      )
    }
    header = rows[headerIndex]!.map((c) => c.trim())
    dataStart = headerIndex + 1
    format.headerRow = headerIndex + 1
  } else {
    dataStart = (mapping.headerRow ?? 1) - 1
  }
  format.columns = header
  const byKey = new Map<string, number>()
  header.forEach((h, i) => {
    if (!byKey.has(headerKey(h))) byKey.set(headerKey(h), i)
  })
  const locate = (ref: ColumnRef): { index: number; name: string } => {
    if (typeof ref === 'number') return { index: ref, name: header[ref] || `column ${ref + 1}` }
    const index = byKey.get(headerKey(ref))
    if (index === undefined) throw new FailedFile(`Column "${ref}" is not in the header (found: ${header.map((h) => `"${h}"`).join(', ')}).`)
    return { index, name: header[index]! }
  }
  const time = locate(mapping.time.column)
  const tod = mapping.time.timeOfDayColumn !== undefined ? locate(mapping.time.timeOfDayColumn).index : null
  const dataRows = rows.slice(dataStart).filter((r) => r.some((c) => c.trim() !== ''))
  const valueIndexes = mapping.columns.map((c) => locate(c.column).index)
  const decimal = mapping.decimal === 'auto' ? detectDecimal(dataRows.map((r) => valueIndexes.map((i) => r[i] ?? ''))) : mapping.decimal
  format.decimal = decimal
  const timeCell = (r: string[]) => (tod === null ? (r[time.index] ?? '') : `${r[time.index] ?? ''} ${r[tod] ?? ''}`)
  const guess = mapping.time.format === 'auto' ? guessTimeFormat(dataRows.slice(0, 200).map(timeCell)) : { format: mapping.time.format, assumption: null }
  format.timeFormat = guess.format
  const columns = mapping.columns.map((c, k): ResolvedColumn => {
    const kind = kindOf(c.unit)
    const { index, name } = locate(c.column)
    return { index, name, quantity: c.quantity, stage: c.stage ?? null, label: c.label ?? name, kind, unit: c.unit, read: reader(kind, c.unit, decimal) }
  })
  return { delimiter, decimal, headerIndex, dataStart, timeFormat: guess.format, timeAssumption: guess.assumption, timeIndex: time.index, timeName: time.name, todIndex: tod, columns }
}

interface Stats {
  count: number
  missing: number
  min: number
  max: number
  sum: number
  last: number | null
  lastAt: number | null
}

/** Everything that accumulates while rows stream by; fixed size whatever the file length. */
class RowState {
  private record = 0
  private dataRows = 0
  private valid = 0
  private empty = 0
  private rowsWithErrors = 0
  private readonly errors: LoggerRowError[] = []
  private errorCount = 0
  private readonly warnings: string[] = []
  private lastT: number | null = null
  private firstT: number | null = null
  private duplicates = 0
  private readonly intervals: number[] = []
  private typicalMs: number | null = null
  private gaps = 0
  private longestGapMs = 0
  private readonly stats: Stats[]
  private readonly chart: TimeBuckets
  private readonly analysis: TimeBuckets
  private readonly values: (number | null)[]
  private readonly needed: number
  private readonly offsetMs: number
  private readonly runIdx: number
  private run = { prev: null as number | null, since: 0, starts: 0, short: 0, onMs: 0, knownMs: 0, prevT: 0, firstAt: null as number | null }
  private lastProgress = -1
  private clockShiftMs = 0
  private readonly readTime: (text: string) => Cell<number>

  constructor(
    private readonly mapping: LoggerMapping,
    private readonly setup: Settled,
    private readonly options: ProcessOptions,
  ) {
    const n = setup.columns.length
    this.stats = setup.columns.map(() => ({ count: 0, missing: 0, min: Infinity, max: -Infinity, sum: 0, last: null, lastAt: null }))
    this.chart = new TimeBuckets(options.chartPoints ?? 1024, n)
    this.analysis = new TimeBuckets(options.analysisPoints ?? 16_384, n)
    this.values = new Array(n).fill(null)
    this.needed = Math.max(setup.timeIndex, setup.todIndex ?? 0, ...setup.columns.map((c) => c.index)) + 1
    this.offsetMs = isElapsed(setup.timeFormat) && mapping.time.startedAt ? Date.parse(mapping.time.startedAt) : 0
    this.runIdx = setup.columns.findIndex((c) => c.quantity === 'compressorRunning')
    if (setup.timeAssumption) this.warnings.push(setup.timeAssumption)
    this.readTime = timeReader(setup.timeFormat, mapping.time.utcOffsetMinutes)
  }

  private error(row: number, column: string | null, message: string): void {
    this.errorCount++
    if (this.errors.length < (this.options.maxErrors ?? 100)) this.errors.push({ row, column, message })
  }

  addPapaErrors(errors: Papa.ParseError[]): void {
    // papaparse numbers rows within the chunk; quote problems are rare in logger files, so name the record
    // roughly (the next one) rather than track chunk offsets.
    for (const e of errors) this.error(this.record + (e.row ?? 0) + 1, null, `${e.message}; check the quotes on this row`)
  }

  addRows(rows: string[][]): void {
    const s = this.setup
    for (const row of rows) {
      const line = ++this.record
      if (line - 1 < s.dataStart) continue
      if (row.length === 1 && row[0]!.trim() === '') {
        this.empty++
        continue
      }
      this.dataRows++
      if (row.length < this.needed) {
        this.rowsWithErrors++
        this.error(line, null, `has ${row.length} field${row.length === 1 ? '' : 's'}, ${this.needed} or more expected (check the delimiter "${s.delimiter === '\t' ? 'tab' : s.delimiter}")`)
        continue
      }
      const timeText = s.todIndex === null ? row[s.timeIndex]! : `${row[s.timeIndex]} ${row[s.todIndex]}`
      const time = this.readTime(timeText)
      if (!time.ok) {
        this.rowsWithErrors++
        this.error(line, s.timeName, `time ${time.reason}`)
        continue
      }
      let t = time.value + this.offsetMs + this.clockShiftMs
      if (this.lastT !== null && t < this.lastT && this.isClockChange(this.lastT - t)) {
        // Loggers on local time repeat an hour when daylight-saving time ends; from here on their
        // clock is one hour behind the offset in the mapping, so later times move forward one hour.
        this.clockShiftMs += 3_600_000
        t += 3_600_000
        this.warnings.push(`At row ${line} the logger's clock went back one hour (the end of daylight-saving time?); later times were moved forward one hour.`)
      }
      if (this.lastT !== null && t < this.lastT) {
        this.rowsWithErrors++
        this.error(line, s.timeName, `time goes back (${new Date(t).toISOString()} after ${new Date(this.lastT).toISOString()}); rows must be in time order`)
        continue
      }
      let rowHasError = false
      for (let k = 0; k < s.columns.length; k++) {
        const col = s.columns[k]!
        const cell = col.read(row[col.index]!)
        if (!cell.ok) {
          rowHasError = true
          this.error(line, col.name, cell.reason)
          this.values[k] = null
        } else this.values[k] = cell.value
      }
      if (rowHasError) this.rowsWithErrors++
      this.accept(t)
    }
  }

  private accept(t: number): void {
    this.valid++
    if (this.firstT === null) this.firstT = t
    if (this.lastT !== null) {
      const dt = t - this.lastT
      if (dt === 0) this.duplicates++
      else if (this.typicalMs === null) {
        this.intervals.push(dt)
        if (this.intervals.length >= 1000) this.settleInterval()
      } else this.noteInterval(dt)
    }
    for (let k = 0; k < this.values.length; k++) {
      const v = this.values[k] ?? null
      const st = this.stats[k]!
      if (v === null) {
        st.missing++
        continue
      }
      st.count++
      if (v < st.min) st.min = v
      if (v > st.max) st.max = v
      st.sum += v
      st.last = v
      st.lastAt = t
    }
    if (this.runIdx >= 0) this.trackCompressor(t, this.values[this.runIdx] ?? null)
    this.chart.add(t, this.values)
    this.analysis.add(t, this.values)
    this.lastT = t
  }

  /** A step back of one hour (within two sampling intervals) on a calendar clock. */
  private isClockChange(backMs: number): boolean {
    if (isElapsed(this.setup.timeFormat)) return false
    const slack = Math.max(2 * (this.typicalMs ?? this.intervals[0] ?? 60_000), 1000)
    return Math.abs(backMs - 3_600_000) <= slack
  }

  private settleInterval(): void {
    const sorted = [...this.intervals].sort((a, b) => a - b)
    this.typicalMs = sorted.length ? sorted[Math.floor(sorted.length / 2)]! : null
    for (const dt of this.intervals) this.noteInterval(dt)
    this.intervals.length = 0
  }

  private noteInterval(dt: number): void {
    if (this.typicalMs !== null && dt > 10 * this.typicalMs && dt > 60_000) {
      this.gaps++
      if (dt > this.longestGapMs) this.longestGapMs = dt
    }
  }

  private trackCompressor(t: number, state: number | null): void {
    const r = this.run
    if (r.prev !== null) {
      r.knownMs += t - r.prevT
      if (r.prev === 1) r.onMs += t - r.prevT
    }
    if (state === null) {
      r.prev = null
      return
    }
    if (r.firstAt === null) r.firstAt = t
    if (state === 1 && r.prev === 0) {
      r.starts++
      r.since = t
    }
    if (state === 0 && r.prev === 1 && r.starts > 0 && t - r.since < SHORT_CYCLE_MS) r.short++
    r.prev = state
    r.prevT = t
  }

  progress(bytesRead: number): void {
    const cb = this.options.onProgress
    if (!cb) return
    const total = this.options.totalBytes ?? null
    const fraction = total ? Math.min(1, bytesRead / total) : null
    const step = fraction === null ? Math.floor(this.record / 50_000) : Math.floor(fraction * 100)
    if (step === this.lastProgress) return
    this.lastProgress = step
    cb({ bytesRead, totalBytes: total, fraction, rows: this.record })
  }

  finish(format: LoggerAnalysis['format']): LoggerAnalysis {
    if (this.typicalMs === null) this.settleInterval()
    const s = this.setup
    const rows = { total: this.record, data: this.dataRows, valid: this.valid, withErrors: this.rowsWithErrors, empty: this.empty }
    if (this.valid === 0 || this.firstT === null || this.lastT === null) {
      const a = emptyAnalysis(this.dataRows ? 'No row could be read: see the errors.' : 'The file has a header but no data rows.', format, this.warnings)
      return { ...a, rows, errors: this.errors }
    }
    const errorShare = this.rowsWithErrors / Math.max(1, this.dataRows)
    if (this.errorCount > this.errors.length) this.warnings.push(`${this.errorCount} problems in all; the first ${this.errors.length} are listed.`)
    if (this.duplicates) this.warnings.push(`${this.duplicates} rows repeat the time of the row before.`)
    if (this.gaps) this.warnings.push(`${this.gaps} gaps in the recording, the longest ${(this.longestGapMs / 60_000).toFixed(0)} min.`)
    const series: LoggerSeries[] = s.columns.map((c, k) => {
      const st = this.stats[k]!
      return {
        column: c.name,
        quantity: c.quantity,
        stage: c.stage,
        label: c.label,
        unit: seriesUnit(c.kind, c.unit),
        count: st.count,
        missing: st.missing,
        min: st.count ? st.min : null,
        max: st.count ? st.max : null,
        mean: st.count ? st.sum / st.count : null,
        last: st.last,
        lastAt: st.lastAt,
        points: this.chart.points(k),
      }
    })
    const idx = (q: string) => s.columns.findIndex((c) => c.quantity === q)
    const setpoint = this.setpoint(idx('setpointTemperature'))
    const column = (k: number) => (k < 0 ? null : Array.from({ length: this.analysis.length }, (_, i) => this.analysis.mean(i, k)))
    const cabinet = idx('cabinetTemperature')
    const report =
      cabinet < 0
        ? { pullDowns: [], stalls: [], warmUps: [], symptoms: [], notes: ['No cabinet temperature column: no pull-down analysis.'] }
        : analysePullDown(
            {
              t: Array.from({ length: this.analysis.length }, (_, i) => this.analysis.timeOf(i)),
              cabinetC: column(cabinet)!,
              running: column(this.runIdx),
              ambientC: column(idx('ambientTemperature')),
              cascadeHxC: column(idx('cascadeHxTemperature')),
            },
            { setpointC: setpoint.value, ...this.mapping.analysis },
          )
    this.warnings.push(...report.notes)
    const r = this.run
    const compressor = this.runIdx >= 0 && r.knownMs > 0 ? { starts: r.starts, shortCycles: r.short, runFraction: r.onMs / r.knownMs, hours: r.knownMs / 3_600_000 } : null
    const symptoms = [...report.symptoms]
    if (compressor && compressor.shortCycles >= 6 && compressor.shortCycles / compressor.hours >= 2) {
      symptoms.push({ symptom: 'compressor-short-cycling', evidence: `${compressor.shortCycles} compressor runs shorter than 5 min in ${compressor.hours.toFixed(1)} h (${compressor.starts} starts).` })
    }
    const elapsed = isElapsed(s.timeFormat) && !this.mapping.time.startedAt
    return {
      status: errorShare > MAX_ERROR_SHARE ? 'failed' : this.errorCount ? 'ok-with-errors' : 'ok',
      failure: errorShare > MAX_ERROR_SHARE ? `${Math.round(errorShare * 100)} % of the data rows have errors: check the delimiter, decimal mark, time format and units of the mapping.` : null,
      rows,
      errors: this.errors,
      warnings: this.warnings,
      format,
      timeBase: elapsed ? 'elapsed' : 'absolute',
      span: {
        startAt: this.firstT,
        endAt: this.lastT,
        minutes: (this.lastT - this.firstT) / 60_000,
        typicalIntervalSeconds: this.typicalMs === null ? null : this.typicalMs / 1000,
        gaps: this.gaps,
        longestGapMinutes: this.longestGapMs / 60_000,
      },
      chartBucketSeconds: this.chart.width / 1000,
      analysisResolutionSeconds: this.analysis.width / 1000,
      series,
      setpointC: setpoint.value,
      setpointSource: setpoint.source,
      pullDowns: report.pullDowns,
      stalls: report.stalls,
      warmUps: report.warmUps,
      compressor,
      offered: { readings: this.offeredReadings(series, setpoint, compressor, elapsed), symptoms: dedupe(symptoms) },
    }
  }

  private setpoint(columnIndex: number): { value: number | null; source: LoggerAnalysis['setpointSource'] } {
    if (this.mapping.setpointC !== undefined) return { value: this.mapping.setpointC, source: 'mapping' }
    const st = columnIndex >= 0 ? this.stats[columnIndex]! : null
    if (st && st.last !== null) {
      if (st.max - st.min > 0.5) this.warnings.push(`The setpoint changed during the log (${st.min.toFixed(1)} to ${st.max.toFixed(1)} °C); the last value is used.`)
      return { value: st.last, source: 'column' }
    }
    if (this.options.unitSetpointC !== undefined) return { value: this.options.unitSetpointC, source: 'unit' }
    return { value: null, source: null }
  }

  private offeredReadings(series: LoggerSeries[], setpoint: { value: number | null; source: LoggerAnalysis['setpointSource'] }, compressor: LoggerAnalysis['compressor'], elapsed: boolean): OfferedReading[] {
    const out: OfferedReading[] = []
    const at = (t: number | null) => (elapsed ? null : t)
    for (const s of series) {
      if (s.quantity === 'other' || s.last === null) continue
      const q: Quantity = s.quantity
      if (q === 'setpointTemperature') continue
      const stage = isStageQuantity(q) && s.stage ? { stage: s.stage } : {}
      if (q === 'compressorRunning') {
        out.push({ quantity: q, ...stage, value: s.last === 1, unit: 'bool', at: at(s.lastAt), note: `Last logged state (${s.column})` })
        continue
      }
      const unit: ReadingUnit = s.unit === 'kPa' ? 'kPa' : s.unit === 'A' ? 'A' : 'C'
      out.push({ quantity: q, ...stage, value: round(s.last, 2), unit, at: at(s.lastAt), note: `Last logged value (${s.column})` })
    }
    if (setpoint.value !== null && setpoint.source !== 'unit') out.push({ quantity: 'setpointTemperature', value: setpoint.value, unit: 'C', at: null, note: setpoint.source === 'mapping' ? 'Setpoint given with the mapping' : 'Last logged setpoint' })
    const r = this.run
    if (compressor && r.prev === 1 && this.lastT !== null) {
      // Running all through the log: the run began before it, so the figure is a lower bound.
      const throughout = r.starts === 0
      const since = throughout ? (r.firstAt ?? this.lastT) : r.since
      const note = throughout ? 'The compressor ran all through the log: at least this many minutes' : 'Minutes the compressor had run since its last start, at the end of the log'
      out.push({ quantity: 'runtime', value: round((this.lastT - since) / 60_000, 1), unit: 'min', at: at(this.lastT), note })
    }
    return out
  }
}

function round(v: number, decimals: number): number {
  const f = 10 ** decimals
  return Math.round(v * f) / f
}

function dedupe(symptoms: LoggerAnalysis['offered']['symptoms']): LoggerAnalysis['offered']['symptoms'] {
  const seen = new Map<string, string[]>()
  for (const s of symptoms) seen.set(s.symptom, [...(seen.get(s.symptom) ?? []), s.evidence])
  return [...seen].map(([symptom, evidence]) => ({ symptom: symptom as LoggerAnalysis['offered']['symptoms'][number]['symptom'], evidence: evidence.join(' ') }))
}
