/**
 * Wire types of data-logger files on a case (`/api/cases/{id}/logger-files`, `/api/logger-files/{id}`):
 * the first look at the file, the column mapping, the background analysis and what was accepted.
 */
import type { LoggerMappingInput } from '#shared/schemas/logger'
import type { LoggerAnalysis } from './logger'

/** The first look at an uploaded file, from its first 64 KB. */
export interface LoggerPreviewDto {
  encoding: string
  delimiter: string
  decimal: '.' | ','
  headerRow: number | null
  header: string[]
  rows: string[][]
  suggestion: { mapping: LoggerMappingInput; unmapped: string[]; notes: string[] }
}

export interface LoggerFileDto {
  id: number
  caseId: number
  originalName: string
  bytes: number
  uploadedAt: string
  preview: LoggerPreviewDto
  loggerModel: string | null
  /** The mapping used for the analysis, once one was chosen. */
  mapping: LoggerMappingInput | null
  /** The mapping last saved for this logger model, when the file names one. */
  rememberedMapping: LoggerMappingInput | null
  jobId: string | null
  analysis: LoggerAnalysis | null
  acceptedAt: string | null
}

/** `POST /api/logger-files/{id}/process` answer. */
export interface LoggerJobDto {
  jobId: string
  loggerFileId: number
}

/** `GET /api/logger-mappings?model=` answer. */
export interface LoggerMappingDto {
  loggerModel: string
  mapping: LoggerMappingInput
  updatedAt: string
}
