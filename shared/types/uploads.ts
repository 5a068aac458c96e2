/** A stored photo or PDF of a case or a unit, with the URLs that serve its file and preview. */
export interface UploadDto {
  id: number
  mime: string
  bytes: number
  originalName: string
  purpose: string
  url: string
  thumbUrl: string | null
  createdAt: string
}
