// Small real files for upload tests, made on the spot so the repository carries no binaries.
import sharp from 'sharp'
import type { ApiClient } from '../helpers'

/** A 640 × 400 PNG with a little detail, so the thumbnail is really scaled down. */
export function samplePng(): Promise<Buffer> {
  const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="640" height="400"><rect width="640" height="400" fill="#0e7490"/><circle cx="320" cy="200" r="120" fill="#f8fafc"/></svg>'
  return sharp(Buffer.from(svg)).png().toBuffer()
}

/**
 * A real HEIC photo (HEVC in a HEIF container, brand "heic", as iPhones write), 320 × 200: a teal
 * ground, a white disc in the middle and a red square in the top-left corner. Drawn for these tests and
 * encoded with libheif's heif-enc 1.15.1 (x265, quality 40); no encoder is at hand in Node, so the
 * 1.5 kB file is kept here as text.
 */
export const SAMPLE_HEIC = Buffer.from(
  [
    'AAAAHGZ0eXBoZWljAAAAAG1pZjFoZWljbWlhZgAAAkZtZXRhAAAAAAAAACFoZGxyAAAAAAAAAABwaWN0AAAAAAAAAAAAAAAAAAAAAA5waXRtAAAAAAABAAAA',
    'NGlsb2MAAAAAREAAAgABAAAAAAJqAAEAAAAAAAADIwACAAAAAAWNAAEAAAAAAAAAOgAAADhpaW5mAAAAAAACAAAAFWluZmUCAAAAAAEAAGh2YzEAAAAAFWlu',
    'ZmUCAAAAAAIAAGh2YzEAAAABhWlwcnAAAAFgaXBjbwAAAHhodmNDAQNwAAAAAAAAAAAAPPAA/P34+AAADwMgAAEAGEABDAH//wNwAAADAJAAAAMAAAMAPLoC',
    'QCEAAQArQgEBA3AAAAMAkAAAAwAAAwA8oAoIDJZbqSSmubgQEDAgAAADACAAAAMAISIAAQAHRAHBcrBiQAAAABRpc3BlAAAAAAAAAUAAAADIAAAAEHBpeGkA',
    'AAAAAwgICAAAAHNodmNDAQQIAAAAAAAAAAAAPPAA/Pz4+AAADwMgAAEAF0ABDAH//wQIAAADAJ/4AAADAAA8ugJAIQABACdCAQEECAAAAwCf+AAAAwAAPMAo',
    'IDJZbqSSmubAgAAAAwCAAAADAIQiAAEAB0QBwXKwYkAAAAAUaXNwZQAAAAAAAAFAAAAAyAAAAA5waXhpAAAAAAEIAAAAJ2F1eEMAAAAAdXJuOm1wZWc6aGV2',
    'YzoyMDE1OmF1eGlkOjEAAAAAHWlwbWEAAAAAAAAAAgABA4ECgwACBIQFhocAAAAaaXJlZgAAAAAAAAAOYXV4bAACAAEAAQAAA2VtZGF0AAADHygBr1IJj7tf',
    'kPkOkl//7lr//XE5D5gaxynluP8m33zz6FtkDLXttnQJD4Sxfjvyecm1lFOJvqbRskjbQ3pzaS5a7liFKaXTWa7CRdknzrJFcxfRkGcE21vgj7U/AwfkZG25',
    'tS1Uw///cSDt0ZdpZs7mhqDLQ0L6IRTbu68XSl5O0JHxutGOUSYEO8RvTMn4BsLklOiMW1mR14o9vajMqNAE7k//s559F+VbuhYFkXGEKmbiXUYSrxfDXY91',
    'FnAMK3lcdXihP1KN2PGMlYO7Onqv1YVmndC5pN+YwPG+glIYicDoiRS7rwaiDqxZtozfaDHoetoTlN8tEGk1lwE0QrwIzeTj1dFCRgCoFf9S/XbLxzXPlVfi',
    'x3unLlTEgCsZnm3Qd+DyYhYClsI5A2lTWokEGsHlHw9eBnD2iqQSKtduE71QurxWCjg8Xy0NnzDWUaNjArtTFI9qZvjMPHIXUMHjh9iooSHFjO23kk6siBh+',
    'Y0PYzl5Z3cDlxXWc0Fn7Umlbfpk4soA2RKQqlK6g3RXMnvDF7n/ryp39cXTL+q6DTygkm6WQjwnSqXXelWA6NMWRLSm4P4Y5wMQrFGV/ti8v3LIvybfvawG5',
    '2ixQt5/0AQsj1oFoZ0TTP1qOujXdQS+48sBl5JlGGbL5CNY6OXbWL40RGKMg7IFsRluTytNe1VWR19Ff1l3EpmLN7+nzFK+QgjcAWcCngEH2qrMo3kHhkhAe',
    '5BZ7wjKIlA/6zOEQjQmfmMaiTRj8HW44fGHwl3YD+69XLxeQRBK1KKZjMsj97H1XLnDXfUmdF/yVMbhIuLmBo6vbEWWRJO57wuicVuZCbOSveTt04cOE8+2x',
    'NPAwkEoHADdUCTi3NZlbzmE2BRMPVem2V/1IND+8VaU6Qz11Mooz50keGaKpWE5Z2iX/+ldxa1G2FC9WiMBzsheW+Am0w3/hii+qcZyDGnsZaKFEc6dwkgYV',
    'VoY4OBQEx/BO0dg7l8gcwYyiMlbdLoGTCNL8SqzmVB46T6SbkUVZIMY6MtjQJjoE+oMyGM6dQvr3yFrAnYAMkA/wXIAA+YAAAAA2KAGupCxQaO8SsPQfvLJD',
    'gQZWVPS3QOshILZURgXYaRPxEJ2KwpUAAhaNgACjAAADAAADAAEl',
  ].join(''),
  'base64',
)

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
