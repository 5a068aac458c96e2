// Small real files for upload tests, made on the spot so the repository carries no binaries.
import sharp from 'sharp'
import type { ApiClient } from '../helpers'

/** A 640 × 400 PNG with a little detail, so the thumbnail is really scaled down. */
export function samplePng(): Promise<Buffer> {
  const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="640" height="400"><rect width="640" height="400" fill="#0e7490"/><circle cx="320" cy="200" r="120" fill="#f8fafc"/></svg>'
  return sharp(Buffer.from(svg)).png().toBuffer()
}

/** The smallest PDF most readers open: one empty page. */
export const SAMPLE_PDF = Buffer.from(
  [
    '%PDF-1.4',
    '1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj',
    '2 0 obj << /Type /Pages /Kids [3 0 R] /Count 1 >> endobj',
    '3 0 obj << /Type /Page /Parent 2 0 R /MediaBox [0 0 200 200] >> endobj',
    'trailer << /Root 1 0 R >>',
    '%%EOF',
    '',
  ].join('\n'),
)

/** A multipart body with one file (and a purpose when given). */
export function fileForm(bytes: Uint8Array, name: string, declaredType = 'application/octet-stream', purpose?: string): FormData {
  const form = new FormData()
  form.append('file', new Blob([new Uint8Array(bytes)], { type: declaredType }), name)
  if (purpose !== undefined) form.append('purpose', purpose)
  return form
}

/** Opens a case on the first unit the client sees; returns its id and unit id. */
export async function openCase(client: ApiClient, complaint = 'Cabinet warm, alarm at -60 °C'): Promise<{ id: number; unitId: number }> {
  const units = (await client.get('/api/units')).body as { id: number }[]
  const opened = await client.post('/api/cases', { unitId: units[0]!.id, complaint, symptoms: ['not-cooling'] })
  if (opened.status !== 201) throw new Error(`could not open a case: ${opened.status} ${JSON.stringify(opened.body)}`)
  return { id: opened.body.id, unitId: units[0]!.id }
}

/** Closes a case with a confirmed cause and no refrigerant moved. */
export async function closeCase(client: ApiClient, id: number) {
  const closed = await client.post(`/api/cases/${id}/close`, {
    confirmedCauses: [{ cause: 'condenser-airflow' }],
    workDone: 'Cleaned a blocked condenser coil and checked the fan; cabinet pulling down again.',
    refrigerantTransactions: [],
  })
  if (closed.status !== 200) throw new Error(`could not close case ${id}: ${closed.status} ${JSON.stringify(closed.body)}`)
  return closed.body
}
