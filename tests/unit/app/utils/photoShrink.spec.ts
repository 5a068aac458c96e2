import { beforeEach, describe, expect, it, vi } from 'vitest'

const compress = vi.fn()
// A browser that cannot decode the file: a plain function, so no spy keeps the rejection around.
let failing = false
vi.mock('browser-image-compression', () => ({
  default: (...args: unknown[]) => (failing ? Promise.reject(new Error('The file given is not an image')) : compress(...args)),
}))
const { PHOTO_MAX_EDGE_PX, shrinkPhoto, shrunkName } = await import('~/utils/photoShrink')

const file = (bytes: number, type: string, name = 'plant-room.jpeg') => new File([new Uint8Array(bytes)], name, { type })

describe('shrinking a photo before it is sent', () => {
  beforeEach(() => {
    compress.mockReset()
    failing = false
  })

  it('asks for a long edge of at most 2560 px, in the page itself, without the metadata', async () => {
    compress.mockResolvedValue(new Blob([new Uint8Array(1000)], { type: 'image/jpeg' }))
    const out = await shrinkPhoto(file(8_000_000, 'image/jpeg'))
    expect(compress.mock.calls[0]![1]).toMatchObject({ maxWidthOrHeight: PHOTO_MAX_EDGE_PX, useWebWorker: false, preserveExif: false, fileType: 'image/jpeg' })
    expect(PHOTO_MAX_EDGE_PX).toBe(2560)
    expect(out).toMatchObject({ size: 1000, type: 'image/jpeg', name: 'plant-room.jpg' })
  })

  it('turns a PNG photo into a JPEG with the matching name', async () => {
    compress.mockResolvedValue(new Blob([new Uint8Array(500)], { type: 'image/jpeg' }))
    const out = await shrinkPhoto(file(5_000_000, 'image/png', 'nameplate.PNG'))
    expect(out).toMatchObject({ type: 'image/jpeg', name: 'nameplate.jpg' })
  })

  it('keeps the file as it is when shrinking would not make it smaller, or it is a PDF', async () => {
    const small = file(2000, 'image/jpeg')
    compress.mockResolvedValue(new Blob([new Uint8Array(3000)], { type: 'image/jpeg' }))
    expect(await shrinkPhoto(small)).toBe(small)
    const pdf = file(9_000_000, 'application/pdf', 'certificate.pdf')
    expect(await shrinkPhoto(pdf)).toBe(pdf)
    expect(compress).toHaveBeenCalledTimes(1)
  })

  it('keeps the file as it is when the browser cannot read it as an image', async () => {
    const broken = file(2000, 'image/jpeg', 'note.jpg')
    failing = true
    expect(await shrinkPhoto(broken)).toBe(broken)
  })

  it('names the shrunk file after the original with its new extension', () => {
    expect(shrunkName('IMG_2041.HEIC.jpeg', 'image/jpeg')).toBe('IMG_2041.HEIC.jpg')
    expect(shrunkName('drier.webp', 'image/webp')).toBe('drier.webp')
    expect(shrunkName('.jpeg', 'image/jpeg')).toBe('photo.jpg')
  })
})
