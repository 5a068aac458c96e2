/** Inputs of the data-logger upload: the file's name and logger model, the processing request, what is accepted. */
import { z } from 'zod'
import { LoggerMappingSchema } from './logger'
import { symptomSchema } from './diagnosis'

const loggerModel = z.string({ error: 'The logger model is text' }).trim().min(1, 'Name the logger model').max(120, 'A logger model has at most 120 characters')

/** Query of `POST /api/cases/{id}/logger-files` (the body is the CSV itself). */
export const LoggerUploadQuerySchema = z.object({
  name: z.string().trim().min(1, 'Give the file name (query "name")').max(200),
  loggerModel: loggerModel.optional(),
})

/** `POST /api/logger-files/{id}/process`. */
export const LoggerProcessSchema = z
  .object({
    mapping: LoggerMappingSchema,
    /** Saves the mapping for this logger model, to be offered for its next file. */
    loggerModel: loggerModel.optional(),
  })
  .strict()
export type LoggerProcessInput = z.infer<typeof LoggerProcessSchema>

/** `POST /api/logger-files/{id}/accept`: which offered readings (by position) and symptoms go into the case. */
export const LoggerAcceptSchema = z
  .object({
    readings: z.array(z.number().int().min(0)).max(100).default([]),
    symptoms: z.array(symptomSchema).max(20).default([]),
  })
  .strict()
  .refine((a) => a.readings.length + a.symptoms.length > 0, { message: 'Tick at least one reading or symptom to add', path: ['readings'] })
export type LoggerAcceptInput = z.infer<typeof LoggerAcceptSchema>

/** `GET /api/logger-mappings?model=`. */
export const LoggerMappingQuerySchema = z.object({ model: loggerModel })
