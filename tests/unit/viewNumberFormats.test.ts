// Numbers and dates on screen are written through vue-i18n's formatters with the named formats of
// src/i18n/formats.ts, so a Spanish reader and an English one each get their own writing from one place. The
// lint configuration refuses the browser's own formatting (toFixed, toLocaleString, Intl) in views and components,
// in a script and in a template; these probes run the project's own lint configuration so the rule cannot quietly
// stop matching (the named formats themselves: tests/unit/client/numberFormats.test.ts).
// source: vue-i18n guide, "Number Formatting" (n() with named formats); common practice (one formatting rule per project)
import { fileURLToPath } from 'node:url'
import { ESLint } from 'eslint'
import { beforeAll, describe, expect, it } from 'vitest'

const root = fileURLToPath(new URL('../..', import.meta.url))
let eslint: ESLint

async function refusals(code: string, filePath = 'src/views/counter/ProbeView.vue'): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: `${root}/${filePath}` })
  return result.messages.filter((m) => /no-restricted-syntax$/.test(m.ruleId ?? '') && /toFixed/.test(m.message)).map((m) => m.ruleId!)
}
const sfc = (script: string, template = '<div />') => `<script setup lang="ts">\n${script}\n</script>\n<template>${template}</template>\n`

beforeAll(() => {
  eslint = new ESLint({ cwd: root })
})

describe('numbers on screen go through the named formats', () => {
  it('refuses toFixed, toLocaleString and Intl in a view script, a component template and a view helper', async () => {
    expect(await refusals(sfc('const area = (x: number) => x.toFixed(1)\nvoid area'))).toEqual(['no-restricted-syntax'])
    expect(await refusals(sfc('const props = defineProps<{ kg: number }>()\nvoid props', '<span>{{ kg.toFixed(0) }} kg</span>'), 'src/components/counter/Probe.vue')).toEqual([
      'vue/no-restricted-syntax',
    ])
    expect(await refusals(sfc('const when = (d: Date) => d.toLocaleString()\nvoid when'))).toEqual(['no-restricted-syntax'])
    expect(await refusals('export const pct = (x: number) => new Intl.NumberFormat().format(x)\n', 'src/views/purchasing/probeWords.ts')).toEqual(['no-restricted-syntax'])
  })

  it("lets a view write a number with vue-i18n's n() and a named format", async () => {
    expect(await refusals(sfc("import { useI18n } from 'vue-i18n'\nconst { n } = useI18n()\nconst area = (x: number) => n(x, 'tenths')\nvoid area"))).toEqual([])
  })
})
