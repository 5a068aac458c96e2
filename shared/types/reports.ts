// The service report model: built on the server (server/domain/reports/service-report.ts), shown
// by the printable page, rendered to PDF and written into the e-mail. Every text in it is for
// people: labels from the vocabulary, figures with their units, times in the organisation's zone.
import type { EmailDto } from './cases'

export interface ReportRow {
  label: string
  value: string
  note?: string
  /** The value is a figure (set in the monospaced face); words are set in the text face. */
  figure?: boolean
  /** When it was read or done, in the organisation's time zone, and by whom. */
  time?: string
  by?: string
  /** Struck out: shown struck through, with the reason in the note. */
  struck?: boolean
  /** A detail of the row above it (a step's figures). */
  detail?: boolean
}

export interface ReportSection {
  title: string
  rows: ReportRow[]
  /** `table`: rows are laid out as a table of readings with their time and who took them. */
  layout?: 'list' | 'table'
}

/** A photo the technician picked for the report. */
export interface ReportPhoto {
  id: number
  caption: string
  url: string
  thumbUrl: string | null
}

/**
 * Someone who may receive the report: the site's contacts (those who receive reports preselected)
 * and the organisation's people. Other addresses only an engineer or an admin may add.
 */
export interface ReportRecipient {
  name: string
  email: string
  preselected: boolean
  /** 'contact': a contact of the unit's site; 'colleague': a person of the organisation. */
  kind: 'contact' | 'colleague'
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
  photos: ReportPhoto[]
  /** The customer's acknowledgement line, printed with space to sign. */
  acknowledgement: string
  /** Who the report can go to (not printed). */
  recipients: ReportRecipient[]
}

/** Answer of `POST /api/cases/{id}/report/send`: how many e-mails were queued, all of the case's e-mails, and the jobs delivering the new ones. */
export interface ReportSendResult {
  queued: number
  emails: EmailDto[]
  jobIds: string[]
}
