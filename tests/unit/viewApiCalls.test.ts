// Views and components reach the server through the typed area modules in src/api, never by a path: the lint
// rule 'lumenyard/views-call-api-modules' (eslint.config.ts) refuses a path call there. These probes run the
// project's own lint configuration on small view sources, so the rule cannot quietly stop matching.
// source: common practice (one typed gateway per area; ESLint no-restricted-syntax / no-restricted-imports)
import { fileURLToPath } from 'node:url'
import { ESLint } from 'eslint'
import { beforeAll, describe, expect, it } from 'vitest'

const root = fileURLToPath(new URL('../..', import.meta.url))
let eslint: ESLint

async function problems(code: string, filePath = 'src/views/stock/ProbeView.vue'): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: `${root}/${filePath}` })
  return result.messages.filter((m) => m.ruleId === 'no-restricted-syntax' || m.ruleId === 'no-restricted-imports').map((m) => m.ruleId!)
}
const sfc = (script: string) => `<script setup lang="ts">\n${script}\n</script>\n<template><div /></template>\n`

beforeAll(() => {
  eslint = new ESLint({ cwd: root })
})

describe('views call the API through area modules', () => {
  it('refuses a path call, an import of the raw client and a raw download in a view', async () => {
    expect(await problems(sfc("import { api } from '@/api/client'\nvoid api.get('/items/7')"))).toEqual(['no-restricted-imports', 'no-restricted-syntax'])
    expect(await problems(sfc("import { download } from '@/api/client'\nvoid download(`/items/export.xlsx`)"))).toEqual(['no-restricted-imports', 'no-restricted-syntax'])
    expect(await problems(sfc("void fetch('/api/items')"))).toContain('no-restricted-syntax')
  })

  it('refuses the same in a component and a view helper module', async () => {
    expect(await problems(sfc("import { api } from '../../api/client'\nvoid api.post(`/jobs/${1}/takeoffs`, {})"), 'src/components/counter/Probe.vue')).toEqual([
      'no-restricted-imports', 'no-restricted-syntax',
    ])
    expect(await problems("import { api } from '@/api/client'\nexport const x = () => api.delete('/customers/3')\n", 'src/views/counter/probeData.ts')).toHaveLength(2)
  })

  it('lets a view call an area module and tell an API error apart', async () => {
    expect(await problems(sfc("import { catalogApi } from '@/api/catalog'\nimport { isApiError } from '@/api/client'\nvoid catalogApi.item(7).catch((e) => isApiError(e))"))).toEqual([])
  })
})
