// Data-logger files on a case: the upload with a first look at the file, the column-mapping step
// (remembered per logger model), the analysis as a background job with progress, and the readings and
// symptoms the technician accepts into the case. Every step is scoped to the actor's organisation.
import { randomUUID } from 'node:crypto'
import { Readable } from 'node:stream'
import { caseUnitId } from '#server/db/repositories/case-records'
import { findUnit } from '#server/db/repositories/equipment'
import {
  findCaseLoggerFiles, findLoggerFile, findRememberedMapping, insertLoggerFile, markLoggerFileAccepted, rememberMapping, saveLoggerAnalysis,
  saveLoggerMappingChoice, type LoggerFileRecord,
} from '#server/db/repositories/logger-files'
import { BadInputError, InvalidStateError, NotFoundError, UnavailableError } from '#server/domain/errors'
import { previewLoggerCsv } from '#server/domain/logger/logger-preview'
import { processLoggerCsv } from '#server/domain/logger/logger-processor'
import { openStoredStream, type StoredStream } from '#server/utils/upload-storage'
import { AddReadingsSchema } from '#shared/schemas/cases'
import type { LoggerAcceptInput, LoggerProcessInput } from '#shared/schemas/logger-files'
import type { CaseDto } from '#shared/types/cases'
import type { LoggerAnalysis } from '#shared/types/logger'
import type { LoggerFileDto, LoggerJobDto, LoggerMappingDto } from '#shared/types/logger-files'
import { addReadings, getCase, setSymptoms } from './cases'
import { defineJob, enqueueJob } from './jobs'
import type { Actor } from './types'

/** How much of the head of a file the mapping step checks before queueing the whole analysis. */
const HEAD_BYTES = 256 * 1024

/** The first `HEAD_BYTES` of the file, cut after its last whole line. */
function headOf(bytes: Buffer): Buffer {
  if (bytes.length <= HEAD_BYTES) return bytes
  const cut = bytes.lastIndexOf(0x0a, HEAD_BYTES)
  return bytes.subarray(0, cut > 0 ? cut + 1 : HEAD_BYTES)
}

/**
 * A stored file's chunks, passed on as they come. The analysis runs in a web process: every few chunks
 * it lets the process answer other requests and its database pool's timers, which a tight parse of
 * chunks that are already at hand would starve.
 */
function yielding(input: Readable): Readable {
  return Readable.from((async function* () {
    let n = 0
    for await (const chunk of input) {
      yield chunk as Buffer
      if (n++ % 8 === 7) await new Promise((resolve) => setImmediate(resolve))
    }
  })())
}

/** The stored file as a stream (read from the store a chunk at a time, never whole), or 404 when it is gone. */
async function openStored(key: string, end?: number): Promise<StoredStream> {
  const config = useRuntimeConfig()
  const opened = await openStoredStream({ uploadDriver: config.uploadDriver, uploadDir: config.uploadDir, s3: config.s3 }, key, end)
  if (!opened) throw new NotFoundError('The stored logger file is missing; upload it again.')
  return opened
}

/** The head of a stored file (HEAD_BYTES at most, cut after its last whole line), read without the rest. */
async function storedHead(key: string): Promise<Buffer> {
  const { stream } = await openStored(key, HEAD_BYTES + 1)
  const chunks: Buffer[] = []
  for await (const chunk of stream) chunks.push(chunk as Buffer)
  return headOf(Buffer.concat(chunks))
}

async function dto(record: LoggerFileRecord): Promise<LoggerFileDto> {
  const { organisationId, storageKey: _key, ...rest } = record
  const remembered = record.loggerModel ? await findRememberedMapping(organisationId, record.loggerModel) : null
  return { ...rest, rememberedMapping: remembered?.mapping ?? null }
}

async function fileOf(actor: Actor, id: number): Promise<LoggerFileRecord> {
  const record = await findLoggerFile(actor.organisationId, id)
  if (!record) throw new NotFoundError('Logger file not found')
  return record
}

/** `POST /api/cases/{id}/logger-files`: stores a CSV for an open case with a first look at it (400 when it is no logger file). */
export async function addLoggerFile(actor: Actor, input: { caseId: number; name: string; loggerModel?: string; bytes: Buffer }): Promise<LoggerFileDto> {
  const preview = await previewLoggerCsv(Readable.from([headOf(input.bytes)]))
  if (preview.failure) throw new BadInputError(`${input.name}: ${preview.failure}`, { file: [preview.failure] })
  const { failure: _none, ...look } = preview
  const storageKey = `org-${actor.organisationId}/logger-${randomUUID()}`
  try {
    await useStorage('uploads').setItemRaw(storageKey, input.bytes)
  } catch (error) {
    console.error('[logger] storage write failed:', error instanceof Error ? error.message : error)
    throw new UnavailableError('The file store is not reachable right now. Nothing was saved; try again in a moment.')
  }
  const id = await insertLoggerFile({
    organisationId: actor.organisationId, caseId: input.caseId, originalName: input.name.slice(0, 200), bytes: input.bytes.length, storageKey,
    preview: look, loggerModel: input.loggerModel ?? null, uploadedBy: actor.id,
  })
  return dto(await fileOf(actor, id))
}

/** `GET /api/logger-files/{id}`: the file, its mapping and, once worked, its analysis. */
export async function getLoggerFile(actor: Actor, input: { loggerFileId: number }): Promise<LoggerFileDto> {
  return dto(await fileOf(actor, input.loggerFileId))
}

/** `GET /api/cases/{id}/logger-files`: the case's logger files, newest first (analyses left out). */
export async function caseLoggerFiles(actor: Actor, input: { caseId: number }): Promise<LoggerFileDto[]> {
  await getCase(actor, input)
  return Promise.all((await findCaseLoggerFiles(actor.organisationId, input.caseId)).map(dto))
}

/** `GET /api/logger-mappings?model=`: the mapping remembered for a logger model, or 404. */
export async function rememberedMapping(actor: Actor, input: { model: string }): Promise<LoggerMappingDto> {
  const found = await findRememberedMapping(actor.organisationId, input.model)
  if (!found) throw new NotFoundError(`No mapping is saved for the logger model "${input.model}" yet`)
  return found
}

function rowErrors(analysis: LoggerAnalysis): string[] {
  return analysis.errors.slice(0, 10).map((e) => `Row ${e.row}${e.column ? `, column "${e.column}"` : ''}: ${e.message}`)
}

interface LoggerJobData { loggerFileId: number }

/** The analysis of one logger file, streamed from the file store chunk by chunk with its progress reported. */
export const loggerAnalysisJob = defineJob<LoggerJobData, { loggerFileId: number; status: LoggerAnalysis['status']; rows: number; errors: number }>('logger-analysis', {
  retryLimit: 1,
  retryDelaySeconds: 10,
  expireInSeconds: 20 * 60,
  run: async (data, job) => {
    const record = await findLoggerFile(job.organisationId, data.loggerFileId)
    if (!record || !record.mapping) throw new Error('The logger file or its mapping is gone')
    const unitId = await caseUnitId(job.organisationId, record.caseId)
    const unit = unitId ? await findUnit(job.organisationId, unitId) : null
    const stored = await openStored(record.storageKey)
    const analysis = await processLoggerCsv(yielding(stored.stream), record.mapping, {
      totalBytes: stored.size,
      // Progress is shown, not needed: a write that fails (a busy pool) must not fail the analysis.
      onProgress: (p) => void job.progress((p.fraction ?? 0) * 0.98).catch(() => undefined),
      ...(unit?.design.cabinetC != null ? { unitSetpointC: unit.design.cabinetC } : {}),
    })
    await saveLoggerAnalysis(record.id, analysis)
    return { loggerFileId: record.id, status: analysis.status, rows: analysis.rows.valid, errors: analysis.rows.withErrors }
  },
})

/**
 * `POST /api/logger-files/{id}/process`: checks the mapping on the head of the file at once (400 naming
 * the row and column when the file cannot be read with it), remembers it for the logger model, and
 * queues the analysis of the whole file.
 */
export async function processLoggerFile(actor: Actor, input: { loggerFileId: number } & LoggerProcessInput): Promise<LoggerJobDto> {
  const record = await fileOf(actor, input.loggerFileId)
  const head = await processLoggerCsv(Readable.from([await storedHead(record.storageKey)]), input.mapping)
  if (head.status === 'failed') {
    const lines = rowErrors(head)
    const message = `${record.originalName} cannot be read with this mapping: ${head.failure ?? 'too many rows with errors'}${lines.length ? ` ${lines[0]}` : ''}`
    throw new BadInputError(message, { file: [head.failure ?? 'Too many rows with errors', ...lines] })
  }
  const loggerModel = input.loggerModel ?? record.loggerModel
  const jobId = await useDb().transaction(async (transaction) => {
    const id = await enqueueJob(loggerAnalysisJob, { loggerFileId: record.id }, { organisationId: actor.organisationId, createdBy: actor.id }, { transaction })
    await saveLoggerMappingChoice(record.id, { mapping: input.mapping, loggerModel, jobId: id })
    return id
  })
  if (loggerModel) await rememberMapping(actor.organisationId, loggerModel, input.mapping, actor.id)
  return { jobId, loggerFileId: record.id }
}

/** `POST /api/logger-files/{id}/accept`: adds the offered readings and symptoms the technician ticked to the case. */
export async function acceptLoggerFindings(actor: Actor, input: { loggerFileId: number } & LoggerAcceptInput, now: Date): Promise<CaseDto> {
  const record = await fileOf(actor, input.loggerFileId)
  const analysis = record.analysis
  if (!analysis || analysis.status === 'failed') throw new InvalidStateError('This file has no finished analysis to take readings from yet.')
  const offered = analysis.offered
  const bad = input.readings.find((i) => i >= offered.readings.length)
  if (bad !== undefined) throw new BadInputError(`Reading ${bad} was not offered; the analysis offers ${offered.readings.length}`, { readings: [`Reading ${bad} was not offered`] })
  const stray = input.symptoms.find((s) => !offered.symptoms.some((o) => o.symptom === s))
  if (stray) throw new BadInputError(`The symptom "${stray}" was not offered by this file`, { symptoms: [`"${stray}" was not offered`] })
  let current = await getCase(actor, { caseId: record.caseId })
  if (input.readings.length) {
    const readings = input.readings.map((i) => {
      const r = offered.readings[i]!
      return { quantity: r.quantity, ...(r.stage ? { stage: r.stage } : {}), value: r.value, unit: r.unit }
    })
    current = await addReadings(actor, { caseId: record.caseId, ...parseAs(AddReadingsSchema, { readings }) }, now)
  }
  const added = input.symptoms.filter((s) => !current.symptoms.includes(s))
  if (added.length) current = await setSymptoms(actor, { caseId: record.caseId, symptoms: [...current.symptoms, ...added] }, now)
  await markLoggerFileAccepted(record.id, now)
  return current
}
