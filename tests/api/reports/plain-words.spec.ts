// What a person reads about a case (the printable report page, the PDF, the e-mail and the case's
// timeline) carries people's words only: none of the API's machine words may show through.
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs'
import { beforeAll, describe, expect, it } from 'vitest'
import { CASE_EVENT_TYPES } from '#shared/types/cases'
import { CAUSES, QUANTITIES, SYMPTOMS, TESTS, UNIT_KINDS } from '#shared/types/diagnosis'
import { EQUIPMENT_CLASSES } from '#shared/types/equipment'
import { FIELD_WORDS, TEST_WORDS } from '#shared/utils/vocabulary'
import { ApiClient, DEMO, signedIn } from '../helpers'

// Hyphenated or camelCase words only: "other", "low" or "cascade" are also plain English.
const MACHINE_WORDS = [
  ...CAUSES, ...TESTS, ...SYMPTOMS, ...QUANTITIES, ...CASE_EVENT_TYPES, ...UNIT_KINDS, ...EQUIPMENT_CLASSES, ...Object.keys(FIELD_WORDS),
  ...Object.values(TEST_WORDS).flatMap((t) => Object.keys(t.outcomes ?? {})),
].filter((w, i, all) => /-|[a-z][A-Z]/.test(w) && all.indexOf(w) === i)

function machineWordsIn(text: string): string[] {
  return MACHINE_WORDS.filter((w) => new RegExp(`(?<![\\w-])${w}(?![\\w-])`).test(text))
}

/** The text a browser shows of a server-rendered page: no scripts, styles, tags or attributes. */
function visibleText(html: string): string {
  return html
    .replace(/<script[\s\S]*?<\/script>/gi, ' ')
    .replace(/<style[\s\S]*?<\/style>/gi, ' ')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&nbsp;/g, ' ').replace(/&amp;/g, '&').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'")
    .replace(/\s+/g, ' ')
}

async function pdfText(bytes: ArrayBuffer): Promise<string> {
  const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, disableFontFace: true, isEvalSupported: false }).promise
  const pages: string[] = []
  for (let n = 1; n <= doc.numPages; n++) {
    const content = await (await doc.getPage(n)).getTextContent()
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '))
  }
  return pages.join('\n')
}

let tech: ApiClient
let demoCase: { id: number; confirmedCauses: { cause: string }[] }

beforeAll(async () => {
  tech = await signedIn(DEMO.tech)
  // A case of the demo's invented history: closed, with readings, test outcomes and findings.
  const closed = (await tech.get('/api/cases?status=closed&pageSize=100')).body.items as { id: number; confirmedCauses: { cause: string }[] }[]
  const full = await Promise.all(closed.slice(0, 30).map(async (c) => (await tech.get(`/api/cases/${c.id}`)).body))
  demoCase = full.find((c) => c.testResults.length > 0 && c.readings.length > 3 && c.symptoms.length > 0 && c.transactions.length > 0) ?? full[0]
})

describe('people\'s words only', () => {
  it('on the printable report page', async () => {
    const res = await tech.raw(`/cases/${demoCase.id}/report`)
    expect(res.status).toBe(200)
    const text = visibleText(await res.text())
    expect(text).toContain('Findings')
    expect(text).toContain('Confirmed cause')
    expect(machineWordsIn(text)).toEqual([])
  })

  it('in the report PDF', async () => {
    const res = await tech.raw(`/api/cases/${demoCase.id}/report.pdf`)
    const text = await pdfText(await res.arrayBuffer())
    expect(text).toContain('Confirmed cause')
    expect(text).toMatch(/Tests and outcomes/)
    expect(machineWordsIn(text)).toEqual([])
  })

  it('in the report e-mail', async () => {
    // An admin may send to an address outside the site's contacts.
    const admin = await signedIn(DEMO.admin)
    const sent = await admin.post(`/api/cases/${demoCase.id}/report/send`, { to: 'words.check@example.test' })
    expect(sent.status).toBe(202)
    const until = Date.now() + 20_000
    let message: { id: string } | undefined
    while (!message && Date.now() < until) {
      const list = ((await admin.get('/api/outbox?pageSize=100')).body as { items: { id: string; to: string; subject: string }[] }).items
      message = list.find((m) => m.to.includes('words.check@example.test') && m.subject.includes(`(case ${demoCase.id})`))
      if (!message) await new Promise((resolve) => setTimeout(resolve, 250))
    }
    expect(message, 'the e-mail reached the outbox').toBeDefined()
    const text = (await admin.get(`/api/outbox/${encodeURIComponent(message!.id)}`)).body.text as string
    expect(text).toContain('Confirmed cause')
    expect(machineWordsIn(text)).toEqual([])
  })

  it('on the case page with its timeline', async () => {
    const res = await tech.raw(`/cases/${demoCase.id}`)
    expect(res.status).toBe(200)
    const text = visibleText(await res.text())
    expect(text).toContain('Timeline')
    expect(text).toContain('Case closed')
    expect(machineWordsIn(text)).toEqual([])
  })

  it('and the check itself would catch a machine word', () => {
    expect(machineWordsIn('Confirmed cause: refrigerant-leak (low)')).toEqual(['refrigerant-leak'])
    expect(machineWordsIn('cabinetTemperature: not derived')).toEqual(['cabinetTemperature'])
  })
})
