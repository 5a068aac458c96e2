import { describe, expect, it } from 'vitest'
import { BadInputError, ConflictError, TooLargeError, UnsupportedTypeError } from '#server/domain/errors'
import { assertCaseTakesUploads, checkUpload, cleanFileName, convertedName, purposeFor } from '#server/domain/uploads/upload-rules'
import { UPLOAD_MAX_BYTES } from '#shared/utils/uploads'

describe('checkUpload', () => {
  it('accepts the four content types up to the limit', () => {
    for (const mime of ['image/jpeg', 'image/png', 'image/webp', 'application/pdf']) expect(checkUpload(100, mime)).toBe(mime)
    expect(checkUpload(UPLOAD_MAX_BYTES, 'image/png')).toBe('image/png')
  })

  it('refuses empty, too large and other content with the matching error', () => {
    expect(() => checkUpload(0, undefined)).toThrow(BadInputError)
    expect(() => checkUpload(UPLOAD_MAX_BYTES + 1, 'image/png')).toThrow(TooLargeError)
    expect(() => checkUpload(UPLOAD_MAX_BYTES + 1, 'image/png')).toThrow(/25 MB/)
    expect(() => checkUpload(10, 'image/gif')).toThrow(UnsupportedTypeError)
    expect(() => checkUpload(10, 'image/gif')).toThrow(/looks like image\/gif.*JPEG, PNG, WebP, HEIC or PDF/)
    expect(() => checkUpload(10, undefined)).toThrow(/not a recognised photo or PDF/)
  })
})

describe('file names and purposes', () => {
  it('names a converted HEIC/HEIF photo as the JPEG it became', () => {
    expect(convertedName('IMG_0042.HEIC')).toBe('IMG_0042.jpg')
    expect(convertedName('nameplate.heif')).toBe('nameplate.jpg')
    // A HEIC recognised by its bytes under another name keeps that name, with .jpg added.
    expect(convertedName('photo')).toBe('photo.jpg')
  })

  it('keeps a readable name without paths, control or quote characters', () => {
    expect(cleanFileName('C:\\Users\\x\\Desktop\\coil.JPG', 'image/jpeg')).toBe('coil.JPG')
    expect(cleanFileName('../../etc/passwd', 'application/pdf')).toBe('passwd')
    expect(cleanFileName('name "with" <quotes>\n.png', 'image/png')).toBe('name with quotes.png')
    expect(cleanFileName('...', 'image/webp')).toBe('upload.webp')
    expect(cleanFileName(`${'a'.repeat(300)}.pdf`, 'application/pdf')).toHaveLength(200)
    expect(cleanFileName(`${'a'.repeat(300)}.pdf`, 'application/pdf').endsWith('.pdf')).toBe(true)
  })

  it('guesses the purpose from the type unless one is given', () => {
    expect(purposeFor('application/pdf', undefined)).toBe('document')
    expect(purposeFor('image/jpeg', undefined)).toBe('photo')
    expect(purposeFor('image/jpeg', 'nameplate')).toBe('nameplate')
  })

  it('refuses files on a closed case', () => {
    expect(() => assertCaseTakesUploads('closed')).toThrow(ConflictError)
    expect(() => assertCaseTakesUploads('open')).not.toThrow()
  })
})
