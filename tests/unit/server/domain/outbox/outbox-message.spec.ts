import { describe, expect, it } from 'vitest'
import { isOutboxFileName, newestFirst, normaliseMessageId, outboxMatches, outboxMessage, outboxSummary, pageOf } from '#server/domain/outbox/outbox-message'

describe('outbox file names', () => {
  it('accepts only bare .eml names of the SMTP fake', () => {
    expect(isOutboxFileName('2026-12-02T10-11-12-123Z-1a2b3c4d.eml')).toBe(true)
    for (const name of ['../x.eml', 'a/b.eml', 'x.eml/..', 'x.txt', '.eml', 'x.eml\0', '%2e%2e.eml']) expect(isOutboxFileName(name)).toBe(false)
  })
})

describe('outbox messages', () => {
  const fileDate = new Date('2026-12-02T10:00:00Z')
  const mail = {
    messageId: '<ABC@host>', date: new Date('2026-12-02T09:00:00Z'), from: 'Rimecase <r@x>', to: 'a@x, b@x', subject: 'Service report',
    text: 'Hello', attachments: [{ filename: 'r.pdf', contentType: 'application/pdf', size: 1234 }, { contentType: 'text/plain', size: 3 }],
  }

  it('lists attachments with download URLs and fallback names', () => {
    const s = outboxSummary('m 1.eml', mail, fileDate)
    expect(s).toMatchObject({ id: 'm 1.eml', date: '2026-12-02T09:00:00.000Z', to: 'a@x, b@x', subject: 'Service report' })
    expect(s.attachments).toEqual([
      { index: 0, filename: 'r.pdf', contentType: 'application/pdf', size: 1234, url: '/api/outbox/m%201.eml/attachments/0' },
      { index: 1, filename: 'attachment-2', contentType: 'text/plain', size: 3, url: '/api/outbox/m%201.eml/attachments/1' },
    ])
  })

  it('falls back to the file date and a placeholder subject, and cuts very long text', () => {
    const m = outboxMessage('x.eml', { attachments: [], text: 'y'.repeat(200_000) }, fileDate)
    expect(m.date).toBe(fileDate.toISOString())
    expect(m.subject).toBe('(no subject)')
    expect(m.text.length).toBeLessThan(100_010)
  })

  it('sorts newest first and matches message ids loosely', () => {
    const a = outboxSummary('a.eml', { ...mail, date: new Date('2026-01-01') }, fileDate)
    const b = outboxSummary('b.eml', { ...mail, date: new Date('2026-02-01') }, fileDate)
    expect([a, b].sort(newestFirst).map((m) => m.id)).toEqual(['b.eml', 'a.eml'])
    expect(normaliseMessageId('<ABC@Host>')).toBe(normaliseMessageId('abc@host'))
  })

  it('matches a search when every word appears in the subject, addresses, text or an attachment name', () => {
    expect(outboxMatches(mail, undefined)).toBe(true)
    expect(outboxMatches(mail, '  ')).toBe(true)
    expect(outboxMatches(mail, 'SERVICE')).toBe(true)
    expect(outboxMatches(mail, 'b@x r.pdf hello')).toBe(true)
    expect(outboxMatches(mail, 'service invoice')).toBe(false)
  })

  it('cuts a page out of the list and keeps the total of all matches', () => {
    const items = Array.from({ length: 45 }, (_, i) => i)
    expect(pageOf(items, 1, 20)).toEqual({ items: items.slice(0, 20), total: 45, page: 1, pageSize: 20 })
    expect(pageOf(items, 3, 20).items).toEqual([40, 41, 42, 43, 44])
    expect(pageOf(items, 4, 20).items).toEqual([])
  })
})
