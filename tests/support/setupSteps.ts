// Steps the setup checklist's browser tests share.
import type { Page } from 'playwright-core'

/** Dismisses the setup checklist (confirming it), lands on the start page and reloads it, settled. */
export async function dismissChecklistAndReload(page: Page): Promise<void> {
  await page.locator('[data-test="setup-dismiss"]').click()
  await page.locator('.el-message-box__btns .el-button--primary').click()
  await page.locator('[data-test="greeting"]').waitFor()
  await page.reload()
  await page.locator('[data-test="greeting"]').waitFor()
  await page.waitForLoadState('networkidle')
}
