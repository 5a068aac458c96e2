// The service report model: built on the server (server/domain/reports/service-report.ts), shown
// by the printable page, rendered to PDF and written into the e-mail. Every text in it is for
// people: labels from the vocabulary, figures with their units, times in the organisation's zone.
import type { EmailDto } from './cases'

export interface ReportRow {
  label: string
  value: string
  note?: string
}

export interface ReportSection {
  title: string
  rows: ReportRow[]
}

export interface ServiceReport {
  title: string
  reference: string
  organisation: string
  technician: string
  openedAt: string
  closedAt: string | null
  /** The organisation's IANA time zone, in which every time of the report is written. */
  timeZone: string
  /** "opened 2026-12-02 14:05 CET · closed …": the case's times as the report states them. */
  when: string
  sections: ReportSection[]
  safetyNotes: string[]
}

/** Answer of `POST /api/cases/{id}/report/send`: how many e-mails were queued, all of the case's e-mails, and the jobs delivering the new ones. */
export interface ReportSendResult {
  queued: number
  emails: EmailDto[]
  jobIds: string[]
}
