// The service report model: built on the server (server/domain/reports/service-report.ts), shown
// by the printable page, rendered to PDF and summarised in the e-mail.
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
  sections: ReportSection[]
  safetyNotes: string[]
}

/** Answer of `POST /api/cases/{id}/report/send`: how many e-mails were queued, and all of the case's e-mails. */
export interface ReportSendResult {
  queued: number
  emails: EmailDto[]
}
