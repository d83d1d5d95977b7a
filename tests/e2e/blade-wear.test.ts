import { randomBytes, randomUUID } from 'node:crypto'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { AnalysisResult } from '../../shared/schemas/analysis'
import { resultOf } from '../factories/analysis-results'
import { baseUrl, launchBrowser } from '../support/browser'
import { api, createVerifiedPerson, signInPage } from '../support/e2e-people'

const tag = randomBytes(3).toString('hex')
const email = `wear-${tag}@example.test`

/** Measured analyses written straight into the app's database: the engine is exercised by blade-photo.test.ts. */
async function storeMeasured(db: pg.Client, bladeId: string, result: AnalysisResult, takenAt: Date): Promise<string> {
  const photoId = randomUUID()
  const id = randomUUID()
  await db.query(`INSERT INTO photos (id, blade_id, storage_key, sha256, content_type, width, height, bytes, uploaded_at)
    VALUES ($1, $2, $3, $4, 'image/jpeg', 4000, 3000, 1, $5)`, [photoId, bladeId, `e2e/${photoId}`, photoId, takenAt])
  await db.query(`INSERT INTO analyses (id, blade_id, photo_id, status, result, algorithm_version, queued_at, finished_at)
    VALUES ($1, $2, $3, 'measured', $4, 'test-model', $5, $5)`, [id, bladeId, photoId, JSON.stringify(result), takenAt])
  return id
}

describe('targets, wear, comparison and exports on the Blade page, in a real browser', () => {
  let browser: Awaited<ReturnType<typeof launchBrowser>>
  const db = new pg.Client({ connectionString: process.env.E2E_DATABASE_URL })

  beforeAll(async () => {
    browser = await launchBrowser()
    await db.connect()
    await createVerifiedPerson(email, 'Skater Wren', { skates: true, coaches: false })
  })
  afterAll(async () => {
    await browser?.dispose()
    await db.end()
  })

  it('shows the wear trend and state, takes a blade preference, compares with the baseline and the pair, and exports', async () => {
    const page = await browser.newPage()
    await signInPage(page, email)
    const skater = await api<{ id: string }>(page, 'POST', '/skaters', { name: 'Wren' })
    const pair = await api<{ id: string; blades: { id: string; side: string }[] }>(page, 'POST', `/skaters/${skater.id}/pairs`, {
      label: 'Show skates', sizeIn: 10, discipline: 'freestyle',
    })
    const left = pair.blades.find((b) => b.side === 'left')!.id
    const right = pair.blades.find((b) => b.side === 'right')!.id
    for (let k = 0; k < 4; k++) {
      const r = resultOf({ removedMm: 0.1 * k, touchPointMm: 39 + k, heelLiftMm: 25, seed: k })
      await storeMeasured(db, left, r, new Date(Date.UTC(2026, 8, 1 + 10 * k, 12)))
      await api(page, 'POST', `/blades/${left}/sharpenings`, { sharpenedOn: new Date(Date.UTC(2026, 8, 5 + 10 * k)).toISOString().slice(0, 10), rootRadiusSixteenths: 7 })
    }
    await storeMeasured(db, right, resultOf({ model: { sizeIn: 10, toe: 'right' }, touchPointMm: 41, heelLiftMm: 25 }), new Date(Date.UTC(2026, 8, 20, 12)))

    await page.goto(`${baseUrl()}/blades/${left}`)
    // Touch point 39 + k against 35–45 mm (DESIGN.md §5): +1 mm per sharpening, 42 mm now, 3 more inside the band.
    const tp = page.locator('figure[data-metric="touchPointMm"] figcaption')
    await tp.waitFor()
    expect(await tp.textContent()).toContain('Trend +1.00 mm per sharpening: about 3 more sharpenings inside 35–45 mm.')
    expect(await page.locator('[data-part="wear-state"]').textContent()).toContain('No re-profile or replacement indicated')
    expect(await page.locator('[data-part="baseline"]').textContent()).toContain('first analysis')

    const row = page.locator('tr[data-target="touchPointMm"]')
    await row.getByRole('button', { name: 'Change' }).click()
    await page.getByLabel('Lower limit').fill('37')
    await page.getByLabel('Upper limit').fill('43')
    await page.getByPlaceholder('Why (optional)').fill('Further forward for spins')
    await page.locator('.targets__form').getByRole('button', { name: 'Save', exact: true }).click()
    await page.waitForFunction(() => document.querySelector('tr[data-target="touchPointMm"]')?.textContent?.includes('37–43 mm'))
    expect(await row.textContent()).toMatch(/this blade.s preference.*Further forward for spins.*Skater Wren \(skater\)/)
    // 39 + k against 37–43 mm: 1 more sharpening now.
    await page.waitForFunction(() => document.querySelector('figure[data-metric="touchPointMm"] figcaption')?.textContent?.includes('about 1 more sharpening inside 37–43 mm'))

    const rows = page.locator('tr[data-history]')
    expect(await rows.count()).toBe(4)
    expect(await rows.first().textContent()).toMatch(/42\.0 ± 1\.2 mm.*near limit \(touch point\)/)
    await page.screenshot({ path: '/tmp/t6/blade-page.png', fullPage: true }).catch(() => undefined)
    await rows.nth(2).getByRole('button', { name: 'Use as reference' }).click()
    await page.waitForFunction(() => document.querySelector('[data-part="baseline"]')?.textContent?.includes('marked reference'))
    expect(await page.locator('[data-part="baseline"]').textContent()).toContain('marked by Skater Wren')
    await page.getByRole('button', { name: 'Now vs baseline' }).click()
    await page.waitForURL(/\/compare\?blade=/)
    await page.getByText('What changed').waitFor()
    // The marked reference (40 mm) against now (42 mm): +2 mm, with ± √2 × 1.2 = 1.70 mm.
    expect(await page.locator('tr[data-change="touchPointMm"]').textContent()).toMatch(/\+2\.00 ± 1\.70 mm.*a measurable change/)
    expect(await page.locator('tr[data-change="middleRadiusMm"]').textContent()).toContain('inside the noise')
    expect(await page.locator('.compare').textContent()).toContain('Steel removed along the blade')
    await page.screenshot({ path: '/tmp/t6/compare-baseline.png', fullPage: true }).catch(() => undefined)

    await page.goto(`${baseUrl()}/compare?pair=${pair.id}`)
    await page.getByText('Left vs right').first().waitFor()
    expect(await page.locator('.notes').textContent()).toContain('mirrors one onto the other')
    // |42 − 41| = 1 mm against our 3 mm left-vs-right rule (DESIGN.md §5).
    expect(await page.locator('.pair-readings [role="img"]').first().getAttribute('aria-label')).toMatch(/^Touch point, left vs right 1\.0 ± 1\.7 mm, target under 3 mm: on target$/)

    const csv = await page.request.get(`${baseUrl()}/api/blades/${left}/history.csv`)
    expect((await csv.text()).split('\r\n')[0]).toMatch(/^date,skater,pair,blade_id,side,size_in,sharpenings_so_far,/)
    const pdf = await page.request.get(`${baseUrl()}/api/blades/${left}/report.pdf`)
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-')
    await page.screenshot({ path: '/tmp/t6/blade-wear.png', fullPage: true }).catch(() => undefined)
  })
})
