// No file, export or dependency that nothing uses: knip (knip.config.ts) reads the whole project from its entries
// (server, client, workers, scripts, benchmarks, tests) and lists what nobody imports. `npm test` runs it here, so a
// new unused export fails CI as well as `npm run lint`; the failure names each finding.
// source: knip's documentation (exit code 1 when issues are found); common practice (dead code is removed, not kept)
import { spawnSync } from 'node:child_process'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'

const root = fileURLToPath(new URL('../..', import.meta.url))

describe('unused code', () => {
  it('knip finds no unused file, export, type or dependency', { timeout: 240_000 }, () => {
    const run = spawnSync(process.execPath, ['node_modules/knip/bin/knip.js', '--no-progress', '--reporter', 'compact'], {
      cwd: root,
      encoding: 'utf8',
      env: { ...process.env, FORCE_COLOR: '0', NO_COLOR: '1' },
    })
    const findings = `${run.stdout}${run.stderr}`.trim()
    expect(run.error).toBeUndefined()
    expect({ exitCode: run.status, findings }).toEqual({ exitCode: 0, findings: '' })
  })
})
