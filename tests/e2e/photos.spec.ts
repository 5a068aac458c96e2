import sharp from 'sharp'
import { PHONE, expect, gotoReady, signIn, test } from './helpers'

test('a full-size phone photo is made smaller in the browser before it is sent', async ({ page }) => {
  test.setTimeout(120_000)
  // A 12-megapixel photo of fine detail, about 10 MB as some phones save them.
  const noise = await sharp({ create: { width: 4000, height: 3000, channels: 3, noise: { type: 'gaussian', mean: 128, sigma: 40 } } }).png().toBuffer()
  const photo = await sharp(noise).jpeg({ quality: 95 }).toBuffer()
  expect(photo.length).toBeGreaterThan(8 * 1024 * 1024)

  await page.setViewportSize(PHONE)
  await signIn(page, 'tech@rimecase.demo')
  const units = (await (await page.request.get('/api/units')).json()) as { id: number }[]
  const { id } = (await (await page.request.post('/api/cases', { data: { unitId: units[0]!.id, complaint: 'Frost on the low-stage suction line' } })).json()) as { id: number }
  await gotoReady(page, `/cases/${id}`)
  await page.getByRole('navigation', { name: 'Case actions' }).getByRole('button', { name: 'Photo' }).click()
  let sent = 0
  page.on('request', (r) => {
    if (r.method() === 'POST' && r.url().endsWith(`/api/cases/${id}/uploads`)) sent = r.postDataBuffer()?.length ?? 0
  })
  await page.getByLabel('Take or add a photo / PDF').setInputFiles({ name: 'suction-line.jpeg', mimeType: 'image/jpeg', buffer: photo })
  await expect(page.getByTestId('upload-shrunk')).toContainText('Photo made smaller for sending', { timeout: 60_000 })
  await page.getByRole('button', { name: 'Add file' }).click()
  await expect(page.getByText('Added suction-line.jpg.')).toBeVisible({ timeout: 30_000 })

  const record = (await (await page.request.get(`/api/cases/${id}`)).json()) as { uploads: { bytes: number; mime: string; originalName: string; url: string }[] }
  const [stored] = record.uploads
  expect(stored).toMatchObject({ mime: 'image/jpeg', originalName: 'suction-line.jpg' })
  expect(stored!.bytes).toBeLessThan(3 * 1024 * 1024)
  expect(sent).toBeLessThan(3 * 1024 * 1024 + 2048)
  const meta = await sharp(Buffer.from(await (await page.request.get(stored!.url)).body())).metadata()
  expect(Math.max(meta.width!, meta.height!)).toBeLessThanOrEqual(2560)
  expect(meta.width! / meta.height!).toBeCloseTo(4 / 3, 2)
})
