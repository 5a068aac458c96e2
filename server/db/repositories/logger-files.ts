// Queries of data-logger files on cases and of the column mappings remembered per logger model.
import { QueryTypes } from 'sequelize'
import type { LoggerMappingInput } from '#shared/schemas/logger'
import type { LoggerAnalysis } from '#shared/types/logger'
import type { LoggerFileDto, LoggerMappingDto, LoggerPreviewDto } from '#shared/types/logger-files'
import { LoggerFile, LoggerMapping } from '../models'

/** A logger file as the services need it: the DTO fields plus where its bytes are. */
export interface LoggerFileRecord extends Omit<LoggerFileDto, 'rememberedMapping'> {
  organisationId: number
  storageKey: string
}

const recordOf = (f: LoggerFile): LoggerFileRecord => ({
  id: f.id, organisationId: f.organisationId, caseId: f.caseId, originalName: f.originalName, bytes: Number(f.bytes), storageKey: f.storageKey,
  uploadedAt: f.createdAt.toISOString(), preview: f.preview as LoggerPreviewDto, loggerModel: f.loggerModel, mapping: (f.mapping ?? null) as LoggerMappingInput | null,
  jobId: f.jobId, analysis: (f.analysis ?? null) as LoggerAnalysis | null, acceptedAt: f.acceptedAt ? f.acceptedAt.toISOString() : null,
})

/** Records an uploaded logger file; returns its id. */
export async function insertLoggerFile(input: { organisationId: number; caseId: number; originalName: string; bytes: number; storageKey: string; preview: LoggerPreviewDto; loggerModel: string | null; uploadedBy: number }): Promise<number> {
  const created = await LoggerFile.create({ ...input, mapping: null, jobId: null, analysis: null, acceptedAt: null })
  return created.id
}

/** A logger file of the organisation, or null. */
export async function findLoggerFile(organisationId: number, id: number): Promise<LoggerFileRecord | null> {
  const f = await LoggerFile.findOne({ where: { id, organisationId } })
  return f ? recordOf(f) : null
}

/** The logger files of a case, newest first, without their analyses. */
export async function findCaseLoggerFiles(organisationId: number, caseId: number): Promise<LoggerFileRecord[]> {
  const files = await LoggerFile.findAll({ where: { organisationId, caseId }, order: [['createdAt', 'DESC']], attributes: { exclude: ['analysis'] } })
  return files.map((f) => ({ ...recordOf(f), analysis: null }))
}

/** Saves the mapping chosen for a file and the job that analyses it; the previous analysis is dropped. */
export async function saveLoggerMappingChoice(id: number, input: { mapping: LoggerMappingInput; loggerModel: string | null; jobId: string }) {
  await LoggerFile.update({ mapping: input.mapping, loggerModel: input.loggerModel, jobId: input.jobId, analysis: null }, { where: { id } })
}

/** Stores the analysis of a file. */
export async function saveLoggerAnalysis(id: number, analysis: LoggerAnalysis) {
  await LoggerFile.update({ analysis }, { where: { id } })
}

/** Marks the file's offered readings as taken into the case. */
export async function markLoggerFileAccepted(id: number, at: Date) {
  await LoggerFile.update({ acceptedAt: at }, { where: { id } })
}

/** The mapping remembered for a logger model (any letter case), or null. */
export async function findRememberedMapping(organisationId: number, loggerModel: string): Promise<LoggerMappingDto | null> {
  const [row] = await LoggerMapping.sequelize!.query<{ logger_model: string; mapping: LoggerMappingInput; updated_at: Date }>(
    'SELECT logger_model, mapping, updated_at FROM logger_mappings WHERE organisation_id = $1 AND upper(logger_model) = upper($2)',
    { bind: [organisationId, loggerModel.trim()], type: QueryTypes.SELECT },
  )
  return row ? { loggerModel: row.logger_model, mapping: row.mapping, updatedAt: new Date(row.updated_at).toISOString() } : null
}

/** Remembers a mapping for a logger model, replacing the one saved before. */
export async function rememberMapping(organisationId: number, loggerModel: string, mapping: LoggerMappingInput, userId: number) {
  await LoggerMapping.sequelize!.query(
    `INSERT INTO logger_mappings (organisation_id, logger_model, mapping, updated_by, created_at, updated_at) VALUES ($1, $2, $3::jsonb, $4, now(), now())
     ON CONFLICT (organisation_id, (upper(logger_model))) DO UPDATE SET mapping = EXCLUDED.mapping, updated_by = EXCLUDED.updated_by, updated_at = now()`,
    { bind: [organisationId, loggerModel.trim(), JSON.stringify(mapping), userId] },
  )
}
