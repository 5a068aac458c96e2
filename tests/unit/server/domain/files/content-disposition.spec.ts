import { describe, expect, it } from 'vitest'
import { contentDisposition } from '#server/domain/files/content-disposition'

describe('contentDisposition', () => {
  it('quotes a plain name and adds the UTF-8 form', () => {
    expect(contentDisposition('inline', 'coil.png')).toBe(`inline; filename="coil.png"; filename*=UTF-8''coil.png`)
  })

  it('cannot be broken by quotes, semicolons, new lines or non-ASCII letters', () => {
    const header = contentDisposition('attachment', 'a"b;c\r\nd – Ölkühler.pdf')
    expect(header).not.toMatch(/[\r\n]/)
    expect(header).toMatch(/^attachment; filename="a_b_c__d _ _lk_hler\.pdf"; filename\*=UTF-8''/)
    expect(decodeURIComponent(header.split("UTF-8''")[1]!)).toBe('a"b;c\r\nd – Ölkühler.pdf')
  })
})
