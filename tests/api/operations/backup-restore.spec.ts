// `npm run backup` and `npm run restore` round trip: data and an upload made before the backup come
// back after they were changed and deleted; a restore over data is refused without --force.
import { spawnSync } from 'node:child_process'
import { readdirSync, rmSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { AppProcess } from '../app-process'
import { DEMO, signedIn, type ApiClient } from '../helpers'
import { fileForm, openCase, samplePng } from '../uploads/fixtures'
import { ROOT, appOn, ownDatabase, uploadDirOf, type OwnDatabase } from './stack'

let db: OwnDatabase
let app: AppProcess | undefined

beforeAll(async () => {
  db = await ownDatabase()
  app = await appOn(db)
}, 120_000)
afterAll(async () => {
  await app?.stop()
  db?.stop()
})

function npmScript(script: 'backup' | 'restore', args: string[]) {
  const result = spawnSync(process.execPath, [join(ROOT, 'scripts', `${script}.mjs`), ...args], {
    cwd: ROOT, encoding: 'utf8', env: { ...process.env, DATABASE_URL: db.databaseUrl, NUXT_UPLOAD_DIR: uploadDirOf(db) }, timeout: 120_000,
  })
  return { status: result.status, out: `${result.stdout}\n${result.stderr}` }
}

const filesUnder = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? filesUnder(join(dir, e.name)) : [join(dir, e.name)]))

describe('backup and restore', () => {
  it('bring back the records and the uploaded file byte for byte after they were changed and deleted', async () => {
    let tech: ApiClient = await signedIn(DEMO.tech, undefined, app!.baseUrl)
    const { id: caseId } = await openCase(tech, 'Cabinet at -62 °C, alarm on; before the backup')
    expect((await tech.post(`/api/cases/${caseId}/notes`, { text: 'Door gasket torn at the hinge side (kept)' })).status).toBe(200)
    const png = await samplePng()
    const uploaded = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(png, 'gasket.png', 'image/png'))
    expect(uploaded.status).toBe(201)
    const before = (await tech.get(`/api/cases/${caseId}`)).body

    const backupDir = join(db.tmp, 'backups')
    const made = npmScript('backup', ['--out', backupDir])
    expect(made.status, made.out).toBe(0)
    const [archive] = readdirSync(backupDir)
    expect(archive).toMatch(/^rimecase-\d{8}T\d{6}Z$/)
    const folder = join(backupDir, archive!)
    expect(readdirSync(folder).sort()).toEqual(['database.dump', 'manifest.json', 'uploads.tar'])
    expect(made.out).toContain(`Backup written to ${folder}`)

    // After the backup: the case changes and every stored file is lost.
    expect((await tech.post(`/api/cases/${caseId}/notes`, { text: 'Written after the backup (goes away)' })).status).toBe(200)
    const later = await openCase(tech, 'Opened after the backup (goes away)')
    rmSync(uploadDirOf(db), { recursive: true, force: true })
    expect((await tech.raw(uploaded.body.url)).status).not.toBe(200)

    // A restore over data is refused and changes nothing.
    const refused = npmScript('restore', [folder])
    expect(refused.status, refused.out).toBe(3)
    expect(refused.out).toMatch(/not empty.*--force/s)
    expect((await tech.get(`/api/cases/${later.id}`)).status).toBe(200)
    // So is one while the app still runs on the database, even with --force.
    const inUse = npmScript('restore', [folder, '--force'])
    expect(inUse.status, inUse.out).toBe(3)
    expect(inUse.out).toMatch(/database is in use: \d+ other connections? .*Stop the app/s)
    expect((await tech.get(`/api/cases/${later.id}`)).status).toBe(200)

    await app!.stop()
    app = undefined
    const restored = npmScript('restore', [folder, '--force'])
    expect(restored.status, restored.out).toBe(0)
    app = await appOn(db)
    tech = await signedIn(DEMO.tech, undefined, app.baseUrl)

    const after = (await tech.get(`/api/cases/${caseId}`)).body
    expect(after.version).toBe(before.version)
    expect(after.notes).toBe(before.notes)
    expect(after.events).toEqual(before.events)
    expect((await tech.get(`/api/cases/${later.id}`)).status).toBe(404)
    const file = await tech.raw(uploaded.body.url)
    expect(file.status).toBe(200)
    expect(Buffer.from(await file.arrayBuffer()).equals(png)).toBe(true)
    const thumb = await tech.raw(uploaded.body.thumbUrl)
    expect(thumb.status).toBe(200)
    expect(filesUnder(uploadDirOf(db)).every((f) => statSync(f).size > 0)).toBe(true)
  }, 180_000)

  it('refuses a folder that is not a backup, and a damaged one', async () => {
    const empty = join(db.tmp, 'not-a-backup')
    spawnSync('mkdir', ['-p', empty])
    const res = npmScript('restore', [empty, '--force'])
    expect(res.status).toBe(1)
    expect(res.out).toMatch(/not a Rimecase backup/)

    const backupDir = join(db.tmp, 'backups-2')
    expect(npmScript('backup', ['--out', backupDir]).status).toBe(0)
    const folder = join(backupDir, readdirSync(backupDir)[0]!)
    spawnSync('truncate', ['-s', '100', join(folder, 'database.dump')])
    const damaged = npmScript('restore', [folder, '--force'])
    expect(damaged.status).toBe(1)
    expect(damaged.out).toMatch(/damaged/)
  }, 120_000)
})
