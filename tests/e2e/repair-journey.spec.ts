// A whole job on a phone, in a scenario of our own: a cascade freezer whose low stage (ethane, gas at
// room temperature) lost charge through a line-tap valve. The technician finds it, brazes an access
// fitting in its place after the hot-work checks, holds nitrogen, evacuates, recharges by standing
// pressure, reads the unit as left, previews the report with a photo and sends it. Then the PDF's
// pages are rendered to images and checked for the figures and the photo they must show.
import { readFileSync, readdirSync, writeFileSync } from 'node:fs'
import { basename, join } from 'node:path'
import { type Page } from '@playwright/test'
import sharp from 'sharp'
import { PHONE, expect, gotoReady, signIn, test } from './helpers'

async function addReading(page: Page, where: string, quantity: string, value: string, unit?: string) {
  const form = page.getByRole('form', { name: 'Add a reading' })
  if (!(await form.isVisible())) await page.getByRole('navigation', { name: 'Case actions' }).getByRole('button', { name: 'Add reading' }).click()
  await form.getByLabel('Where').selectOption({ label: where })
  await form.getByLabel('Quantity').selectOption({ label: quantity })
  await form.getByLabel('Value').fill(value)
  if (unit) await form.getByLabel('Unit').selectOption({ label: unit })
  await form.getByRole('button', { name: 'Add reading' }).click()
  await expect(page.getByTestId('sync-state')).toContainText('All changes saved')
}

function outboxMessages(): string[] {
  const dir = process.env.RIMECASE_OUTBOX_DIR
  if (!dir) return []
  return readdirSync(dir).filter((f) => f.endsWith('.eml')).map((f) => readFileSync(join(dir, f), 'utf8'))
}

/** The step form, with a step kind and stage chosen. */
async function stepForm(page: Page, kind: string) {
  const form = page.getByRole('form', { name: 'Record a repair step' })
  await form.getByRole('combobox', { name: 'Step', exact: true }).selectOption({ label: kind })
  await form.getByRole('combobox', { name: 'Stage', exact: true }).selectOption({ label: 'Low stage (R170)' })
  return form
}

// A photo of a colour nothing else in the report uses, so its pixels can be found on the rendered page.
const PHOTO_RGB = [212, 64, 18] as const
function fittingPhoto(): Promise<Buffer> {
  const [r, g, b] = PHOTO_RGB
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="800" height="600"><rect width="800" height="600" fill="rgb(${r},${g},${b})"/><rect x="300" y="250" width="200" height="100" fill="#e2e8f0"/></svg>`
  return sharp(Buffer.from(svg)).jpeg({ quality: 90 }).toBuffer()
}

test('a phone job on a cascade low stage: leak at a line-tap valve, brazing, nitrogen hold, evacuation, recharge by standing pressure, report previewed and sent', async ({ page }, testInfo) => {
  test.setTimeout(240_000)
  await page.setViewportSize(PHONE)
  await signIn(page, 'tech@rimecase.demo')
  const units = (await (await page.request.get('/api/units')).json()) as { id: number; name: string }[]
  const unit = units.find((u) => u.name === 'Freezer F-204')!
  const opened = await page.request.post('/api/cases', {
    data: { unitId: unit.id, complaint: 'Cabinet at -38 °C; a line-tap valve sits on the low-stage process tube', symptoms: ['not-cooling', 'line-tap-valve-present'] },
  })
  const caseId = (await opened.json()).id as number
  await gotoReady(page, `/cases/${caseId}`)

  // As found: the low stage stands far below what its nameplate charge stands at in this room.
  await addReading(page, 'Unit and room', 'Room (ambient) temperature', '22', '°C')
  await addReading(page, 'Low stage (R170)', 'Standing pressure (off, equalised)', '40', 'psig')
  const charge = page.getByRole('region', { name: 'Standing pressure to charge to' })
  await expect(charge).toContainText('charge to this')
  const chargeTo = Number((await charge.locator('.text-2xl').first().innerText()).replace(/[^\d.]/g, ''))
  expect(chargeTo).toBeGreaterThan(150)
  expect(chargeTo).toBeLessThan(300)

  // The leak search finds it at the line-tap valve.
  await page.request.post(`/api/cases/${caseId}/test-results`, { data: { test: 'leak-search', stage: 'low', outcome: 'leak-found', note: 'Bubbles at the line-tap valve on the low-stage process tube' } })
  await page.reload()

  // Hot work: refused until every check for a stage that held a flammable refrigerant is done.
  let form = await stepForm(page, 'Brazing or other hot work')
  const cautions = form.getByRole('note', { name: /Cautions for this step on the low stage/ })
  await expect(cautions).toContainText('flammable atmosphere')
  await expect(cautions).not.toContainText('hydrogen fluoride')
  await form.getByLabel('What was brazed or cut').fill('Cut out the line-tap valve and brazed an access fitting in its place')
  await form.getByLabel(/Refrigerant recovered/).check()
  await form.getByLabel(/purged with dry nitrogen/).check()
  await form.getByLabel(/nitrogen flowing/).check()
  await form.getByLabel(/Fire extinguisher/).check()
  await form.getByRole('button', { name: 'Record this step' }).click()
  await expect(page.getByRole('status').filter({ hasText: 'flammable' })).toBeVisible()
  await form.getByLabel(/no flammable atmosphere/).check()
  await form.getByLabel(/Hot-work permit/).check()
  await form.getByRole('button', { name: 'Record this step' }).click()
  await expect(page.getByRole('heading', { level: 3, name: /Brazing or other hot work · Low stage: Done/ })).toBeVisible()

  // Nitrogen hold: the gauge fell 4 psi while the plant room cooled 5 K; the correction shows it held.
  form = await stepForm(page, 'Pressure hold with dry nitrogen')
  await expect(form.getByRole('note', { name: /Cautions/ })).toContainText('never oxygen')
  await form.getByLabel('Test pressure').fill('300')
  await form.getByLabel('Hold time (min)').fill('60')
  await form.getByLabel('Start pressure').fill('300')
  await form.getByLabel('Start temperature (°C)').fill('20')
  await form.getByLabel('End pressure').fill('296')
  await form.getByLabel('End temperature (°C)').fill('15')
  await form.getByRole('button', { name: 'Record this step' }).click()
  await expect(page.getByRole('heading', { level: 3, name: /Pressure hold with dry nitrogen · Low stage: Passed/ })).toBeVisible()

  // Evacuation and decay.
  form = await stepForm(page, 'Evacuation and vacuum decay')
  await form.getByLabel('Reached').fill('350')
  await form.getByLabel('Isolated from the pump for (min)').fill('15')
  await form.getByLabel('Vacuum at the end of that time').fill('600')
  await form.getByRole('button', { name: 'Record this step' }).click()
  await expect(page.getByRole('heading', { level: 3, name: /Evacuation and vacuum decay · Low stage: Passed/ })).toBeVisible()

  // Recharge by standing pressure to the figure the case showed, settled at the same room temperature.
  form = await stepForm(page, 'Recharge')
  await form.getByLabel('Standing pressure, settled').fill(String(chargeTo))
  await form.getByLabel('Room temperature (°C)').fill('22')
  await form.getByLabel('Cylinder (optional)').fill('ETH-0107')
  await form.getByRole('button', { name: 'Record this step' }).click()
  await expect(page.getByRole('heading', { level: 3, name: /Recharge · Low stage: Passed/ })).toBeVisible()

  // As left: the cabinet pulling down again.
  await page.getByRole('navigation', { name: 'Case actions' }).getByRole('button', { name: 'Add reading' }).click()
  await page.getByLabel('New readings are taken').selectOption({ label: 'as left' })
  await addReading(page, 'Unit and room', 'Cabinet temperature', '-72', '°C')
  await expect(page.getByRole('article', { name: 'Readings as left' })).toContainText('−72 °C')

  // A photo of the new fitting, then close: the report's preview opens before anything is sent.
  const upload = await page.request.post(`/api/cases/${caseId}/uploads`, { multipart: { file: { name: 'access-fitting.jpg', mimeType: 'image/jpeg', buffer: await fittingPhoto() } } })
  expect(upload.status()).toBe(201)
  const photoId = (await upload.json()).id as number
  await page.reload()
  await page.getByRole('button', { name: 'Close case' }).click()
  const close = page.getByRole('form', { name: 'Close the case' })
  await close.getByLabel('Confirmed cause').selectOption('refrigerant-leak')
  await close.getByLabel('Stage', { exact: true }).selectOption('low')
  await close.getByLabel('Work done').fill('Replaced the leaking line-tap valve with a brazed access fitting; nitrogen hold, evacuation and recharge by standing pressure.')
  await close.getByRole('button', { name: 'Close case and preview the report' }).click()
  await expect(page.getByRole('heading', { level: 1, name: /Service report/ })).toBeVisible()
  for (const title of ['Readings as found', 'Readings as left', 'Repair and verification']) await expect(page.getByRole('heading', { level: 2, name: title })).toBeVisible()
  await expect(page.getByRole('region', { name: 'Repair and verification' })).toContainText('Drop after temperature correction')

  await page.locator(`input[name="photo-${photoId}"]`).check()
  await expect(page.getByRole('heading', { level: 2, name: 'Photos in the report' })).toBeVisible()
  await expect(page.getByRole('checkbox', { name: /Petra Voss/ })).toBeChecked()
  // A technician picks from the site's contacts and the organisation's people; typing another address is for engineers and admins.
  await expect(page.getByLabel('Other addresses (optional)')).toHaveCount(0)
  await page.getByText(/People of your organisation/).click()
  await page.getByRole('checkbox', { name: /Dev Halloran/ }).check()
  await page.getByRole('button', { name: 'Send the report to 2 addresses' }).click()
  await expect(page.getByRole('status').filter({ hasText: 'Queued 2 e-mails' })).toBeVisible()
  await expect.poll(() => outboxMessages().filter((m) => m.includes(`(case ${caseId})`) && m.includes('application/pdf')).length, { timeout: 30_000 }).toBe(2)

  // The PDF's pages rendered to images in the browser with pdfjs-dist.
  const pdf = await (await page.request.get(`/api/cases/${caseId}/report.pdf`)).body()
  const pages = await renderPdf(page, pdf)
  pages.forEach((p, i) => writeFileSync(testInfo.outputPath(`report-page-${i + 1}.png`), Buffer.from(p.png.split(',')[1]!, 'base64')))
  const text = pages.map((p) => p.text).join('\n')
  for (const words of ['Rimecase Demo Field Service', 'Readings as found', 'Readings as left', 'Pressure hold with dry nitrogen', 'Drop after temperature correction', 'Brazing or other hot work', 'Customer acknowledgement', 'PS780-22-0417']) {
    expect(text).toContain(words)
  }
  // Figures are set in the monospaced face, which text extraction may space differently.
  const compact = text.replace(/\s+/g, '')
  expect(compact).toContain('40psig')
  expect(compact).toContain('−72°C')
  expect(compact).toContain('Held:nolossoncethetemperaturechangeistakenout')
  // The photo is painted on a page, and its colour fills a photo-sized area of that page's image.
  const withPhoto = pages.filter((p) => p.images > 0)
  expect(withPhoto.length).toBe(1)
  expect(withPhoto[0]!.photoPixels).toBeGreaterThan(20_000)
  expect(pages.filter((p) => p.images === 0).every((p) => p.photoPixels < 50)).toBe(true)
})

interface RenderedPage {
  text: string
  images: number
  photoPixels: number
  png: string
}

/** Renders each page of a PDF to a canvas in the browser; returns its text, image count, photo-coloured pixels and PNG. */
async function renderPdf(page: Page, bytes: Buffer): Promise<RenderedPage[]> {
  const build = join(process.cwd(), 'node_modules', 'pdfjs-dist', 'build')
  await page.route('**/__pdf-render/**', (route) => {
    const name = basename(new URL(route.request().url()).pathname)
    if (name === 'page.html') return route.fulfill({ contentType: 'text/html', body: '<!doctype html><html><body></body></html>' })
    return route.fulfill({ contentType: 'text/javascript', body: readFileSync(join(build, name)) })
  })
  await page.goto('/__pdf-render/page.html')
  return page.evaluate(async ({ data, rgb }) => {
    const pdfjs = await import('/__pdf-render/pdf.min.mjs' as string)
    pdfjs.GlobalWorkerOptions.workerSrc = '/__pdf-render/pdf.worker.min.mjs'
    const raw = Uint8Array.from(atob(data), (c) => c.charCodeAt(0))
    const doc = await pdfjs.getDocument({ data: raw }).promise
    const out: { text: string; images: number; photoPixels: number; png: string }[] = []
    for (let n = 1; n <= doc.numPages; n++) {
      const p = await doc.getPage(n)
      const viewport = p.getViewport({ scale: 1.5 })
      const canvas = document.createElement('canvas')
      canvas.width = viewport.width
      canvas.height = viewport.height
      const context = canvas.getContext('2d')!
      await p.render({ canvasContext: context, viewport, canvas }).promise
      const ops = await p.getOperatorList()
      const images = ops.fnArray.filter((f: number) => f === pdfjs.OPS.paintImageXObject || f === pdfjs.OPS.paintInlineImageXObject).length
      const pixels = context.getImageData(0, 0, canvas.width, canvas.height).data
      let photoPixels = 0
      for (let i = 0; i < pixels.length; i += 4) {
        if (Math.abs(pixels[i]! - rgb[0]) < 24 && Math.abs(pixels[i + 1]! - rgb[1]) < 24 && Math.abs(pixels[i + 2]! - rgb[2]) < 24) photoPixels++
      }
      const text = (await p.getTextContent()).items.map((i: { str?: string }) => i.str ?? '').join(' ')
      out.push({ text, images, photoPixels, png: canvas.toDataURL('image/png') })
    }
    return out
  }, { data: bytes.toString('base64'), rgb: [...PHOTO_RGB] })
}
