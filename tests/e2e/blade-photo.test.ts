import { randomBytes } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { AnalysisDto } from '../../shared/schemas/analyses'
import { measurablePhoto } from '../factories/photos'
import { baseUrl, launchBrowser } from '../support/browser'
import { api, createVerifiedPerson, signInPage, waitForMailTo } from '../support/e2e-people'

const tag = randomBytes(3).toString('hex')
const skaterEmail = `skater-${tag}@example.test`
const coachEmail = `coach-${tag}@example.test`

describe('a blade photo from upload to annotated measurement, in a real browser', () => {
  let skaterBrowser: Awaited<ReturnType<typeof launchBrowser>>
  let coachBrowser: Awaited<ReturnType<typeof launchBrowser>>
  let photo: Awaited<ReturnType<typeof measurablePhoto>>

  beforeAll(async () => {
    ;[skaterBrowser, coachBrowser, photo] = await Promise.all([
      launchBrowser(), launchBrowser(), measurablePhoto(),
    ])
    await createVerifiedPerson(skaterEmail, 'Skater Runa', { skates: true, coaches: false })
    await createVerifiedPerson(coachEmail, 'Coach Tove', { skates: false, coaches: true })
  })
  afterAll(async () => {
    await skaterBrowser?.dispose()
    await coachBrowser?.dispose()
  })

  it('uploads, shows the touch point, moves the heel end, and mails the skater a coach\'s note', async () => {
    const page = await skaterBrowser.newPage()
    await signInPage(page, skaterEmail)
    const skater = await api<{ id: string }>(page, 'POST', '/skaters', { name: 'Runa' })
    const pair = await api<{ blades: { id: string; side: string }[] }>(page, 'POST', `/skaters/${skater.id}/pairs`, {
      label: 'Competition skates', sizeIn: photo.scene.blade.nominalSizeIn, discipline: 'freestyle',
    })
    const left = pair.blades.find((b) => b.side === 'left')!.id

    await page.goto(`${baseUrl()}/blades`)
    await page.locator('[data-blade="Competition skates:left"]').click()
    await page.getByRole('heading', { name: 'Left blade' }).waitFor()
    await page.getByRole('button', { name: 'Measure with a photo' }).click()
    await page.waitForURL(`${baseUrl()}/blades/${left}/capture`)
    await page.getByText('Print the scale card').waitFor()
    await page.locator('[data-photo-input]').setInputFiles({ name: 'blade.jpg', mimeType: 'image/jpeg', buffer: photo.jpeg })
    await page.waitForURL(/\/analyses\//)
    const touch = page.locator('[data-metric="touchPointMm"]')
    await touch.waitFor({ timeout: 150_000 })
    const analysisId = page.url().split('/analyses/')[1]
    const measured = await api<AnalysisDto>(page, 'GET', `/analyses/${analysisId}`)
    // The page shows the engine's number for this photo, as stored.
    expect(await touch.textContent()).toContain(measured.result!.touchPointMm.toFixed(1))
    expect(await touch.textContent()).toMatch(/on target|near limit|off target/)

    const heelLift = page.locator('[data-fact="heel-lift"]')
    const before = await heelLift.textContent()
    const handle = page.locator('circle[data-landmark="heelEnd"]')
    await handle.scrollIntoViewIfNeeded()
    const box = (await handle.boundingBox())!
    const dx = measured.result!.landmarks.heelEnd.cardMm[0] > measured.result!.landmarks.basePick.cardMm[0] ? -60 : 60
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2)
    await page.mouse.down()
    await page.mouse.move(box.x + box.width / 2 + dx, box.y + box.height / 2, { steps: 8 })
    await page.mouse.up()
    await page.getByText(/Skater Runa moved the heel end/).waitFor()
    expect(await heelLift.textContent()).not.toBe(before)

    const share = await api<{ id: string }>(page, 'POST', `/skaters/${skater.id}/shares/coach`, { email: coachEmail })
    const coach = await coachBrowser.newPage()
    await signInPage(coach, coachEmail)
    await api(coach, 'POST', `/shares/${share.id}/accept`)
    await coach.goto(`${baseUrl()}/analyses/${analysisId}`)
    await coach.getByPlaceholder('What should the skater or the shop look at?').fill('Touch point sits well; keep this profile.')
    await coach.getByRole('button', { name: 'Add note' }).click()
    await coach.locator('[data-note]').getByText('Touch point sits well').waitFor()
    const mail = await waitForMailTo(skaterEmail, /Coach Tove left a note/)
    expect(mail.text).toContain('Touch point sits well')
  })
})
