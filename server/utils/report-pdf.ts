import PDFDocument from 'pdfkit'
import type { ServiceReport } from '#server/domain/reports/service-report'

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

/** Renders a service report to PDF bytes with the bundled fonts. */
export async function renderReportPdf(report: ServiceReport): Promise<Buffer> {
  const f = await loadFonts()
  const doc = new PDFDocument({ size: 'A4', margin: 48, font: f.text as unknown as string, info: { Title: report.title, Author: report.organisation } })
  doc.registerFont('text', f.text)
  doc.registerFont('bold', f.bold)
  doc.registerFont('mono', f.mono)
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))))

  doc.fillColor('#0e7490').font('bold').fontSize(20).text('Rimecase')
  doc.fillColor('#0f172a').font('bold').fontSize(15).text(report.title)
  doc.font('text').fontSize(10).fillColor('#334155')
    .text(`${report.reference} · ${report.organisation} · technician ${report.technician}`)
    .text(report.when[0]!.toUpperCase() + report.when.slice(1))
  for (const section of report.sections) {
    doc.moveDown(0.8).font('bold').fontSize(12).fillColor('#0f172a').text(section.title)
    doc.moveTo(doc.x, doc.y + 2).lineTo(doc.page.width - 48, doc.y + 2).strokeColor('#cbd5e1').stroke().moveDown(0.3)
    for (const row of section.rows) {
      doc.font('text').fontSize(10).fillColor('#334155').text(`${row.label}: `, { continued: true })
      doc.font('mono').fillColor('#0f172a').text(row.value, { continued: !!row.note })
      if (row.note) doc.font('text').fillColor('#475569').text(`  (${row.note})`)
    }
  }
  doc.moveDown(0.8).font('bold').fontSize(12).fillColor('#b91c1c').text('Safety notes')
  doc.font('text').fontSize(10).fillColor('#0f172a')
  for (const note of report.safetyNotes) doc.text(`• ${note}`)
  doc.end()
  return done
}
