// An invented logger file as the app sees it: its first look (preview) and a finished analysis.
import type { LoggerAnalysis, LoggerSeries } from '#shared/types/logger'
import type { LoggerFileDto } from '#shared/types/logger-files'

const START = Date.UTC(2026, 10, 30, 8)
const MIN = 60_000

function series(column: string, label: string, quantity: LoggerSeries['quantity'], values: number[]): LoggerSeries {
  return {
    column, quantity, stage: null, label, unit: 'C', count: values.length, missing: 0, min: Math.min(...values), max: Math.max(...values),
    mean: values.reduce((a, b) => a + b, 0) / values.length, last: values.at(-1)!, lastAt: START + (values.length - 1) * 10 * MIN,
    points: values.map((v, i) => ({ t: START + i * 10 * MIN, min: v - 0.2, max: v + 0.2, mean: v })),
  }
}

export const analysis: LoggerAnalysis = {
  status: 'ok', failure: null, rows: { total: 13, data: 12, valid: 12, withErrors: 0, empty: 0 }, errors: [], warnings: [],
  format: { encoding: 'utf-8', delimiter: ',', decimal: '.', headerRow: 1, timeFormat: 'iso', columns: ['time', 'Cabinet (°C)', 'Ambient (°C)'] },
  timeBase: 'absolute', span: { startAt: START, endAt: START + 110 * MIN, minutes: 110, typicalIntervalSeconds: 600, gaps: 0, longestGapMinutes: 10 },
  chartBucketSeconds: 600, analysisResolutionSeconds: 600,
  series: [
    series('Cabinet (°C)', 'Cabinet', 'cabinetTemperature', [20, 10, 0, -10, -20, -30, -40, -50, -50, -50, -60, -70]),
    series('Ambient (°C)', 'Ambient', 'ambientTemperature', Array.from({ length: 12 }, () => 21)),
  ],
  setpointC: -80, setpointSource: 'mapping', pullDowns: [], stalls: [], warmUps: [], compressor: null, offered: { readings: [], symptoms: [] },
}

/** A file as uploaded: with a header row, or (`bare`) without one, so its columns go by position. */
export function loggerFile(bare: boolean): LoggerFileDto {
  const header = bare ? ['column 1', 'column 2', 'column 3'] : ['time', 'Cabinet (°C)', 'Ambient (°C)']
  return {
    id: 5, caseId: 41, originalName: bare ? 'bare-log.csv' : 'cabinet-log.csv', bytes: 420, uploadedAt: '2026-12-02T09:00:00.000Z',
    preview: {
      encoding: 'utf-8', delimiter: ',', decimal: '.', headerRow: bare ? null : 1, header,
      rows: [['21.0', '2026-11-30T08:00:00Z', '20.0'], ['21.0', '2026-11-30T08:10:00Z', '10.0']],
      suggestion: bare
        ? { mapping: { hasHeader: false, time: { column: 0 }, columns: [] }, unmapped: header, notes: ['The file has no header row: map its columns by position, counting from 0.'] }
        : { mapping: { time: { column: 'time' }, columns: [{ column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'C' }] }, unmapped: ['Ambient (°C)'], notes: [] },
    },
    loggerModel: null, mapping: null, rememberedMapping: null, jobId: null, analysis: null, acceptedAt: null,
  }
}
