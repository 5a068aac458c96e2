/**
 * The text layer of a logger file: its encoding (UTF-8, UTF-16 with a byte-order mark, or Windows-1252
 * as older loggers write "°C"), its delimiter and decimal mark, and where the header row is. Loggers
 * in comma-decimal locales separate columns with semicolons, so the semicolon wins a tie.
 */
import { Transform, type Readable, type TransformCallback } from 'node:stream'
import { BadInputError } from '#server/domain/errors'
import { splitUnit } from './cell-values'

export type Delimiter = ',' | ';' | '\t' | '|'

/** Decodes bytes to text, choosing the encoding from the first chunk, and counts the bytes read. */
export class LoggerTextDecoder extends Transform {
  encoding: string | null = null
  bytesRead = 0
  private decoder: TextDecoder | null = null

  constructor() {
    super({ readableObjectMode: true })
  }

  override _transform(chunk: Buffer, _enc: BufferEncoding, done: TransformCallback): void {
    try {
      this.bytesRead += chunk.length
      if (!this.decoder) this.decoder = this.choose(chunk)
      const text = this.decoder.decode(chunk, { stream: true })
      if (text) this.push(text)
      done()
    } catch (error) {
      done(error as Error)
    }
  }

  override _flush(done: TransformCallback): void {
    const rest = this.decoder?.decode() ?? ''
    if (rest) this.push(rest)
    done()
  }

  private choose(chunk: Buffer): TextDecoder {
    if (chunk[0] === 0xef && chunk[1] === 0xbb && chunk[2] === 0xbf) return this.use('utf-8')
    if (chunk[0] === 0xff && chunk[1] === 0xfe) return this.use('utf-16le')
    if (chunk[0] === 0xfe && chunk[1] === 0xff) return this.use('utf-16be')
    const head = chunk.subarray(0, 65_536)
    if (head.includes(0)) throw new BadInputError('This is not a text CSV file (it contains binary data); export the log as CSV text.')
    try {
      new TextDecoder('utf-8', { fatal: true }).decode(withoutCutCharacter(head))
      return this.use('utf-8')
    } catch {
      return this.use('windows-1252')
    }
  }

  private use(encoding: string): TextDecoder {
    this.encoding = encoding
    // ignoreBOM: false strips a byte-order mark, so the first header name is clean.
    return new TextDecoder(encoding, { ignoreBOM: false })
  }
}

/** The buffer without a multi-byte UTF-8 character cut off at its end (a chunk boundary is not an encoding error). */
function withoutCutCharacter(buf: Buffer): Buffer {
  let i = buf.length - 1
  let continuation = 0
  while (i >= 0 && continuation < 3 && (buf[i]! & 0xc0) === 0x80) {
    i--
    continuation++
  }
  if (i < 0 || buf[i]! < 0xc0) return buf
  const need = buf[i]! >= 0xf0 ? 4 : buf[i]! >= 0xe0 ? 3 : 2
  return buf.length - i < need ? buf.subarray(0, i) : buf
}

const CANDIDATES: Delimiter[] = [';', '\t', '|', ',']

function countOutsideQuotes(line: string, ch: string): number {
  let n = 0
  let quoted = false
  for (const c of line) {
    if (c === '"') quoted = !quoted
    else if (c === ch && !quoted) n++
  }
  return n
}

/**
 * The delimiter that splits the most sample lines into the same number (at least 2) of fields. Lines
 * before the data (a logger's preamble) may differ; the commonest count wins.
 */
export function detectDelimiter(lines: readonly string[]): Delimiter {
  // Spreadsheet exports may name their separator on the first line ("sep=;").
  const declared = /^\uFEFF?sep=(.)\s*$/i.exec(lines[0] ?? '')?.[1]
  if (declared && (CANDIDATES as string[]).includes(declared)) return declared as Delimiter
  const sample = lines.filter((l) => l.trim() !== '').slice(0, 200)
  let best: { d: Delimiter; score: number } | null = null
  for (const d of CANDIDATES) {
    const counts = new Map<number, number>()
    for (const l of sample) {
      const c = countOutsideQuotes(l, d)
      if (c > 0) counts.set(c, (counts.get(c) ?? 0) + 1)
    }
    const top = Math.max(0, ...counts.values())
    // Ties keep the earlier candidate: a decimal comma file also splits evenly on ",".
    if (top > 0 && (!best || top > best.score)) best = { d, score: top }
  }
  return best?.d ?? ','
}

const COMMA_DECIMAL = /^[+-\u2212]?\d+,\d+$/
const POINT_DECIMAL = /^[+-\u2212]?\d*\.\d+$/

/**
 * `,` when numeric cells use a decimal comma. With a comma delimiter that is only possible in quoted
 * cells ("-79,8"), which the parser has already unquoted here.
 */
export function detectDecimal(rows: readonly (readonly string[])[]): '.' | ',' {
  let comma = 0
  let point = 0
  for (const row of rows.slice(0, 500)) {
    for (const cell of row) {
      const c = splitUnit(cell)?.number ?? cell.trim()
      if (COMMA_DECIMAL.test(c)) comma++
      else if (POINT_DECIMAL.test(c)) point++
    }
  }
  return comma > point ? ',' : '.'
}

/** A header name as compared with the mapping: trimmed, case-folded, one space, "°" however encoded. */
export function headerKey(name: string): string {
  return name
    .replace(/\uFFFD|Â°|º/g, '°')
    .replace(/\s+/g, ' ')
    .trim()
    .toLowerCase()
}

/** Index of the first sample row holding every named column, or -1. */
export function findHeaderRow(rows: readonly (readonly string[])[], names: readonly string[]): number {
  const wanted = names.map(headerKey)
  return rows.findIndex((row) => {
    const cells = new Set(row.map(headerKey))
    return wanted.every((w) => cells.has(w))
  })
}

/** Characters read ahead to settle a file's format before the whole of it streams through. */
export const READ_AHEAD_CHARS = 65_536

export interface ReadAhead {
  decoder: LoggerTextDecoder
  /** The rest of the decoded text, after `sample`. */
  rest: AsyncIterator<string>
  sample: string
  /** True when the sample is the whole file. */
  ended: boolean
}

/** Decodes the first 64 KB of a byte stream; throws BadInputError for a binary file. */
export async function readAhead(input: Readable): Promise<ReadAhead> {
  const decoder = new LoggerTextDecoder()
  input.on('error', (e) => decoder.destroy(e))
  const rest = input.pipe(decoder)[Symbol.asyncIterator]() as AsyncIterator<string>
  let sample = ''
  let ended = false
  while (sample.length < READ_AHEAD_CHARS) {
    const r = await rest.next()
    if (r.done) {
      ended = true
      break
    }
    sample += r.value
  }
  return { decoder, rest, sample, ended }
}

/** The sample up to its last complete line (all of it when it is the whole file), and its lines. */
export function completeLines(ahead: Pick<ReadAhead, 'sample' | 'ended'>): { text: string; lines: string[] } {
  const text = ahead.ended ? ahead.sample : ahead.sample.slice(0, ahead.sample.lastIndexOf('\n') + 1) || ahead.sample
  return { text, lines: text.split(/\r\n|\n|\r/) }
}
