/**
 * The first look at a logger file, before any mapping exists: its encoding, separator, decimal mark,
 * the header row (the row above the first run of data rows), the first rows as text, and a suggested
 * mapping. The mapping step shows this; only the first 64 KB are read, so it answers at once for a
 * file of any size.
 */
import type { Readable } from 'node:stream'
import Papa from 'papaparse'
import { BadInputError } from '#server/domain/errors'
import { readNumber } from './cell-values'
import { completeLines, detectDecimal, detectDelimiter, readAhead } from './csv-text'
import { suggestMapping, type MappingSuggestion } from './suggest-mapping'

export interface LoggerPreview {
  encoding: string
  delimiter: string
  decimal: '.' | ','
  /** Line number (from 1) of the header, or null when the data starts without one. */
  headerRow: number | null
  header: string[]
  /** The first data rows, cells as text. */
  rows: string[][]
  suggestion: MappingSuggestion
  /** Set when the file cannot be read at all. */
  failure: string | null
}

const looksNumeric = (cell: string) => {
  const c = cell.trim()
  if (!c || /[a-z]{2}/i.test(c)) return false
  // A decimal-comma figure ("-57,25") counts as much as a decimal-point one.
  return readNumber(c.replace(/[:\-./\sT]/g, ''), '.').ok || readNumber(c, ',').ok || /^\d{1,4}[./-]\d{1,2}[./-]\d{1,4}/.test(c)
}

/** Index of the first of three rows of equal width (2 or more cells) that are mostly figures, or -1. */
function firstDataRow(rows: string[][]): number {
  for (let k = 0; k + 2 < rows.length; k++) {
    const width = rows[k]!.length
    if (width < 2 || rows[k + 1]!.length !== width || rows[k + 2]!.length !== width) continue
    if ([0, 1, 2].every((d) => rows[k + d]!.filter(looksNumeric).length >= Math.ceil(width / 2))) return k
  }
  return -1
}

/** Reads the head of a logger file and proposes how to map it. */
export async function previewLoggerCsv(input: Readable, maxRows = 20): Promise<LoggerPreview> {
  const empty = (failure: string, encoding = 'utf-8'): LoggerPreview => ({ encoding, delimiter: ',', decimal: '.', headerRow: null, header: [], rows: [], suggestion: suggestMapping([]), failure })
  let ahead
  try {
    ahead = await readAhead(input)
  } catch (error) {
    if (error instanceof BadInputError) return empty(error.message)
    throw error
  } finally {
    input.destroy()
  }
  const encoding = ahead.decoder.encoding ?? 'utf-8'
  if (!ahead.sample.trim()) return empty('The file is empty.', encoding)
  const { text, lines } = completeLines(ahead)
  const delimiter = detectDelimiter(lines)
  const rows = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: true }).data
  const start = firstDataRow(rows)
  if (start < 0) return { ...empty('No run of data rows found in the first part of the file: is it a logger export?', encoding), delimiter }
  const above = start > 0 ? rows[start - 1]! : null
  const hasHeader = !!above && above.length === rows[start]!.length && above.filter(looksNumeric).length < above.length / 2
  const header = hasHeader ? above!.map((c) => c.trim()) : rows[start]!.map((_, i) => `column ${i + 1}`)
  const data = rows.slice(start, start + Math.max(1, maxRows))
  // Papa skipped blank lines above; find the header's line number in the raw lines instead.
  const headerRow = hasHeader ? lines.findIndex((l) => Papa.parse<string[]>(l, { delimiter }).data[0]?.map((c) => c.trim()).join('\u0000') === header.join('\u0000')) + 1 || null : null
  const suggestion: MappingSuggestion = hasHeader
    ? suggestMapping(header, data)
    : { mapping: { hasHeader: false, time: { column: 0 }, columns: [] }, unmapped: header, notes: ['The file has no header row: map its columns by position, counting from 0.'] }
  return { encoding, delimiter, decimal: detectDecimal(data), headerRow, header, rows: data, suggestion, failure: null }
}
