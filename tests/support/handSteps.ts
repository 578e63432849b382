// What a person does by hand in a real browser: a scan typed into the handheld's scan box, a signature drawn on the pad.
import type { Page } from 'playwright-core'

/** Draws a signature across the pad with the mouse (pointer events). */
export async function drawSignature(page: Page): Promise<void> {
  const canvas = page.locator('[data-test="signature-canvas"]')
  await canvas.scrollIntoViewIfNeeded()
  const box = (await canvas.boundingBox())!
  await page.mouse.move(box.x + 20, box.y + box.height * 0.6)
  await page.mouse.down()
  for (let i = 1; i <= 24; i++) await page.mouse.move(box.x + 20 + i * 9, box.y + box.height * (0.6 - 0.25 * Math.sin(i / 3)), { steps: 2 })
  await page.mouse.up()
}

/** Types a scan into the handheld's scan box and ends it with Enter, as a keyboard-wedge scanner does. */
export async function scan(page: Page, text: string): Promise<void> {
  const box = page.locator('[data-test="scan-input"]')
  await box.fill(text)
  await box.press('Enter')
}
