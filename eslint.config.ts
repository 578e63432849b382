import pluginVue from 'eslint-plugin-vue'
import { defineConfigWithVueTs, vueTsConfigs } from '@vue/eslint-config-typescript'

// Views and components call the typed area modules in src/api (catalogApi.item(id)), never a path: one place per
// area knows the server's addresses and the schema each answer is checked against.
const VIEW_API_MESSAGE = 'Views and components call a typed module in src/api (e.g. catalogApi.item(id)), not the API by path.'

// Numbers and dates on screen go through vue-i18n's formatters (n(x, 'tenths'), d(date, 'dateTime'); formats in
// src/i18n/formats.ts), so they are written the reader's way; the browser's own formatting is refused in views and
// components, in scripts and templates alike.
const NUMBER_MESSAGE = "Write numbers and dates with vue-i18n's n() / d() and a named format (src/i18n/formats.ts), not toFixed or Intl."
const OWN_FORMATTING = [
  { selector: "CallExpression[callee.property.name=/^(toFixed|toPrecision|toLocaleString|toLocaleDateString|toLocaleTimeString)$/]", message: NUMBER_MESSAGE },
  { selector: "MemberExpression[object.name='Intl']", message: NUMBER_MESSAGE },
]
const V_LOADING = { selector: "VAttribute[directive=true][key.name.name='loading']", message: 'Use v-busy (src/directives/vBusy.ts): v-loading can leave its mask over loaded data.' }

export default defineConfigWithVueTs(
  { name: 'lumenyard/files', files: ['**/*.{ts,mts,vue}'] },
  { name: 'lumenyard/ignores', ignores: ['dist/**', '.data/**', 'node_modules/**', 'test-results/**', 'src/auto-imports.d.ts', 'src/components.d.ts'] },
  pluginVue.configs['flat/essential'],
  vueTsConfigs.recommended,
  {
    name: 'lumenyard/rules',
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-namespace': 'off',
      'vue/multi-word-component-names': ['error', { ignores: [] }],
      // The library's loading directive shows its mask after a quick load has ended (src/directives/vBusy.ts).
      'vue/no-restricted-syntax': ['error', V_LOADING],
    },
  },
  {
    name: 'lumenyard/views-call-api-modules',
    files: ['src/views/**/*.{ts,vue}', 'src/components/**/*.{ts,vue}'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: [
          { name: '@/api/fileTransfer', importNames: ['uploadWithProgress', 'downloadWithProgress'], message: VIEW_API_MESSAGE },
        ],
        patterns: [{ regex: '(^|/)api/client$', importNames: ['api', 'download', 'prefetchGet', 'checkAnswer'], message: VIEW_API_MESSAGE }],
      }],
      'no-restricted-syntax': ['error',
        { selector: "CallExpression[callee.type='MemberExpression'][callee.object.name='api']", message: VIEW_API_MESSAGE },
        { selector: "CallExpression[callee.name=/^(download|downloadWithProgress|uploadWithProgress|prefetchGet|fetch)$/]", message: VIEW_API_MESSAGE },
        { selector: "Literal[value=/^\\/api\\//]", message: VIEW_API_MESSAGE },
        { selector: "TemplateElement[value.raw=/^\\/api\\//]", message: VIEW_API_MESSAGE },
        ...OWN_FORMATTING,
      ],
      'vue/no-restricted-syntax': ['error', V_LOADING, ...OWN_FORMATTING],
    },
  },
)
