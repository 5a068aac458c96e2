import type { Transaction } from 'sequelize'
import type { UploadDto } from '#shared/types/uploads'
import { Upload } from '../models'

/** The URLs that serve an upload's file and, for images, its preview. */
export function uploadUrls(id: number, thumbKey: string | null): Pick<UploadDto, 'url' | 'thumbUrl'> {
  return { url: `/api/uploads/${id}`, thumbUrl: thumbKey ? `/api/uploads/${id}?thumb=1` : null }
}

/** An upload row as the API shows it, with the URLs that serve its file and preview. */
export function uploadDto(u: Upload): UploadDto {
  return {
    id: u.id, mime: u.mime, bytes: u.bytes, originalName: u.originalName, purpose: u.purpose,
    ...uploadUrls(u.id, u.thumbKey), createdAt: u.createdAt.toISOString(),
  }
}

export interface NewUpload {
  organisationId: number
  caseId: number | null
  unitId: number | null
  purpose: string
  mime: string
  bytes: number
  originalName: string
  storageKey: string
  thumbKey: string | null
  uploadedBy: number
}

/** Where an upload's bytes are, for serving them. */
export interface UploadFileRecord {
  id: number
  mime: string
  originalName: string
  storageKey: string
  thumbKey: string | null
}

/** Records an upload whose bytes are already stored. */
export async function insertUpload(input: NewUpload, transaction: Transaction): Promise<UploadDto> {
  return uploadDto(await Upload.create(input, { transaction }))
}

/** An upload of the organisation, or null (another organisation's upload is simply absent). */
export async function findUploadFile(organisationId: number, id: number): Promise<UploadFileRecord | null> {
  const u = await Upload.findOne({ where: { id, organisationId } })
  return u ? { id: u.id, mime: u.mime, originalName: u.originalName, storageKey: u.storageKey, thumbKey: u.thumbKey } : null
}

/** Files attached to a unit itself (nameplate photos, certificates), newest first. */
export async function unitUploads(organisationId: number, unitId: number): Promise<UploadDto[]> {
  const rows = await Upload.findAll({ where: { organisationId, unitId }, order: [['createdAt', 'DESC'], ['id', 'DESC']] })
  return rows.map(uploadDto)
}
