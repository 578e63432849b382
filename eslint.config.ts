import pluginVue from 'eslint-plugin-vue'
import { defineConfigWithVueTs, vueTsConfigs } from '@vue/eslint-config-typescript'

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
      'vue/no-restricted-syntax': ['error', { selector: "VAttribute[directive=true][key.name.name='loading']", message: 'Use v-busy (src/directives/vBusy.ts): v-loading can leave its mask over loaded data.' }],
    },
  },
)
