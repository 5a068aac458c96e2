import PDFDocument from 'pdfkit'
import type { ServiceReport } from '#server/domain/reports/service-report'
import type { ReportRow, ReportSection } from '#shared/types/reports'

const FONT_FILES = {
  text: 'fonts/atkinson-hyperlegible-next-latin-400-normal.woff',
  bold: 'fonts/atkinson-hyperlegible-next-latin-700-normal.woff',
  mono: 'fonts/atkinson-hyperlegible-mono-latin-400-normal.woff',
} as const

type Fonts = Record<keyof typeof FONT_FILES, Buffer>
let fonts: Fonts | undefined

// The app's own fonts, shipped as server assets, so the PDF needs nothing from outside.
async function loadFonts() {
  if (fonts) return fonts
  const storage = useStorage('assets:server')
  const entries = await Promise.all(
    Object.entries(FONT_FILES).map(async ([name, file]) => {
      const raw = await storage.getItemRaw(file)
      if (!raw) throw new Error(`Font ${file} is missing from the server assets`)
      return [name, Buffer.from(raw as ArrayBuffer)] as const
    }),
  )
  fonts = Object.fromEntries(entries) as Fonts
  return fonts
}

/** File name of a case's report PDF, the same in downloads and e-mail attachments. */
export function reportPdfName(caseId: number): string {
  return `rimecase-case-${caseId}-report.pdf`
}

/** A photo for the PDF: JPEG or PNG bytes and its caption. */
export interface PdfPhoto {
  caption: string
  bytes: Buffer
}

const MARGIN = 48
const INK = '#0f172a'
const MUTED = '#475569'
const RULE = '#cbd5e1'
const ACCENT = '#0e7490'

type Doc = InstanceType<typeof PDFDocument>

function ensureRoom(doc: Doc, height: number) {
  if (doc.y + height > doc.page.height - MARGIN) doc.addPage()
}

function sectionTitle(doc: Doc, title: string) {
  // Keep a title with at least its first rows.
  ensureRoom(doc, 90)
  doc.moveDown(0.8).font('bold').fontSize(12).fillColor(INK).text(title, MARGIN)
  const y = doc.y + 2
  doc.moveTo(MARGIN, y).lineTo(doc.page.width - MARGIN, y).lineWidth(0.7).strokeColor(RULE).stroke()
  doc.y = y + 5
}

/** A list section: label in the text face, the value in the monospaced face only when it is a figure. */
function listSection(doc: Doc, section: ReportSection) {
  const width = doc.page.width - 2 * MARGIN
  const labelWidth = 170
  for (const row of section.rows) {
    const indent = row.detail ? 14 : 0
    const valueFont = row.figure ? 'mono' : 'text'
    doc.fontSize(row.detail ? 9 : 10)
    const valueWidth = width - labelWidth - indent
    const valueHeight = doc.font(valueFont).heightOfString(row.value, { width: valueWidth })
    const noteHeight = row.note ? doc.font('text').fontSize(9).heightOfString(row.note, { width: valueWidth }) : 0
    doc.fontSize(row.detail ? 9 : 10)
    const labelHeight = doc.font(row.detail ? 'text' : 'bold').heightOfString(row.label, { width: labelWidth - 8 - indent })
    ensureRoom(doc, Math.max(labelHeight, valueHeight + noteHeight) + 4)
    const top = doc.y
    doc.font(row.detail ? 'text' : 'bold').fillColor(row.detail ? MUTED : INK).text(row.label, MARGIN + indent, top, { width: labelWidth - 8 - indent })
    doc.font(valueFont).fillColor(INK).text(row.value, MARGIN + labelWidth, top, { width: valueWidth, strike: !!row.struck })
    if (row.note) doc.font('text').fontSize(9).fillColor(MUTED).text(row.note, MARGIN + labelWidth, doc.y, { width: valueWidth })
    if (row.time) doc.font('text').fontSize(8.5).fillColor(MUTED).text(`${row.time}${row.by ? ` · ${row.by}` : ''}`, MARGIN + labelWidth, doc.y, { width: valueWidth })
    doc.y = Math.max(doc.y, top + labelHeight) + 3
  }
}

const TABLE_COLUMNS = [
  { title: 'What', width: 0.27 },
  { title: 'Value', width: 0.15 },
  { title: 'Meaning and remarks', width: 0.32 },
  { title: 'Time', width: 0.14 },
  { title: 'By', width: 0.12 },
] as const

/** A table of readings (or outcomes): one row each, with what it means, when and by whom. */
function tableSection(doc: Doc, section: ReportSection) {
  const width = doc.page.width - 2 * MARGIN
  const widths = TABLE_COLUMNS.map((c) => c.width * width)
  const xs = widths.map((_, i) => MARGIN + widths.slice(0, i).reduce((a, b) => a + b, 0))
  const firstColumn = section.title.startsWith('Readings') ? 'Reading' : 'Test'
  const header = () => {
    ensureRoom(doc, 30)
    const top = doc.y
    doc.rect(MARGIN, top - 2, width, 16).fill('#f1f5f9')
    doc.font('bold').fontSize(8.5).fillColor(MUTED)
    TABLE_COLUMNS.forEach((c, i) => doc.text(i === 0 ? firstColumn : c.title, xs[i]! + 3, top + 2, { width: widths[i]! - 6, lineBreak: false }))
    doc.y = top + 17
  }
  header()
  const cells = (row: ReportRow) => [
    { text: row.label, font: 'text' },
    { text: row.value, font: row.figure ? 'mono' : 'text' },
    { text: row.note ?? '', font: 'text' },
    { text: row.time ?? '', font: 'text' },
    { text: row.by ?? '', font: 'text' },
  ]
  for (const row of section.rows) {
    const content = cells(row)
    doc.fontSize(9)
    const height = Math.max(...content.map((c, i) => doc.font(c.font).heightOfString(c.text || ' ', { width: widths[i]! - 6 }))) + 6
    if (doc.y + height > doc.page.height - MARGIN) {
      doc.addPage()
      header()
    }
    const top = doc.y
    content.forEach((c, i) => {
      doc.font(c.font).fontSize(i >= 2 ? 8.5 : 9).fillColor(i >= 2 ? MUTED : INK)
        .text(c.text, xs[i]! + 3, top + 3, { width: widths[i]! - 6, strike: !!row.struck && i < 2 })
    })
    doc.moveTo(MARGIN, top + height).lineTo(MARGIN + width, top + height).lineWidth(0.4).strokeColor(RULE).stroke()
    doc.y = top + height + 1
  }
}

function photosSection(doc: Doc, photos: PdfPhoto[]) {
  if (!photos.length) return
  sectionTitle(doc, 'Photos')
  const width = doc.page.width - 2 * MARGIN
  const cell = (width - 12) / 2
  const imageHeight = cell * 0.75
  photos.forEach((photo, i) => {
    const column = i % 2
    if (column === 0) ensureRoom(doc, imageHeight + 30)
    const top = doc.y
    const x = MARGIN + column * (cell + 12)
    try {
      doc.image(photo.bytes, x, top, { fit: [cell, imageHeight], align: 'center', valign: 'center' })
    } catch {
      doc.font('text').fontSize(9).fillColor(MUTED).text('This photo could not be placed in the PDF.', x, top + imageHeight / 2, { width: cell })
    }
    doc.font('text').fontSize(8.5).fillColor(MUTED).text(photo.caption, x, top + imageHeight + 3, { width: cell })
    doc.y = column === 1 || i === photos.length - 1 ? top + imageHeight + 24 : top
  })
}

/** Renders a service report to PDF bytes with the bundled fonts: the organisation's header, tables of readings, photos, safety notes and the customer's acknowledgement. */
export async function renderReportPdf(report: ServiceReport, photos: PdfPhoto[] = []): Promise<Buffer> {
  const f = await loadFonts()
  const doc = new PDFDocument({ size: 'A4', margin: MARGIN, bufferPages: true, font: f.text as unknown as string, info: { Title: report.title, Author: report.organisation } })
  doc.registerFont('text', f.text)
  doc.registerFont('bold', f.bold)
  doc.registerFont('mono', f.mono)
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))))

  // Header: the organisation that did the work, then what this document is.
  doc.font('bold').fontSize(18).fillColor(ACCENT).text(report.organisation, MARGIN, MARGIN)
  doc.font('text').fontSize(9).fillColor(MUTED).text('Refrigeration service record, kept with Rimecase')
  doc.moveDown(0.6).font('bold').fontSize(15).fillColor(INK).text(report.title)
  doc.font('text').fontSize(10).fillColor('#334155')
    .text(`${report.reference} · technician ${report.technician}`)
    .text(report.when[0]!.toUpperCase() + report.when.slice(1))

  for (const section of report.sections) {
    sectionTitle(doc, section.title)
    if (section.layout === 'table') tableSection(doc, section)
    else listSection(doc, section)
  }
  photosSection(doc, photos)

  sectionTitle(doc, 'Safety notes')
  doc.font('text').fontSize(9.5).fillColor(INK)
  for (const note of report.safetyNotes) {
    ensureRoom(doc, 24)
    doc.text(`• ${note}`, MARGIN, doc.y, { width: doc.page.width - 2 * MARGIN })
  }

  sectionTitle(doc, 'Customer acknowledgement')
  ensureRoom(doc, 90)
  doc.font('text').fontSize(10).fillColor(INK).text(report.acknowledgement, MARGIN, doc.y)
  const lineY = doc.y + 36
  const third = (doc.page.width - 2 * MARGIN - 24) / 3
  ;['Name', 'Signature', 'Date'].forEach((label, i) => {
    const x = MARGIN + i * (third + 12)
    doc.moveTo(x, lineY).lineTo(x + third, lineY).lineWidth(0.7).strokeColor(INK).stroke()
    doc.font('text').fontSize(8.5).fillColor(MUTED).text(label, x, lineY + 3, { width: third })
  })

  // Page numbers and the reference on every page, so a loose page still says where it belongs.
  const range = doc.bufferedPageRange()
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i)
    // Writing inside the bottom margin must not start a new page.
    doc.page.margins.bottom = 0
    const bottom = doc.page.height - MARGIN + 14
    doc.font('text').fontSize(8).fillColor(MUTED)
      .text(`${report.organisation} · ${report.reference} · page ${i + 1} of ${range.count}`, MARGIN, bottom, { width: doc.page.width - 2 * MARGIN, align: 'right', lineBreak: false })
  }
  doc.end()
  return done
}
