import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'
import AutoImport from 'unplugin-auto-import/vite'
import Components from 'unplugin-vue-components/vite'
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers'
import { compression } from 'vite-plugin-compression2'
import { answerChecksOutOfProduction } from './scripts/answerChecks'
import { precompiledMessages } from './scripts/precompiledMessages'
import { routePreloads } from './scripts/routePreloads'

/** The frameworks every page runs: the parts of them the entry imports go into one file, loaded with the entry. */
const FRAMEWORKS = /[\\/]node_modules[\\/](vue|@vue|vue-router|pinia|vue-i18n|@intlify|element-plus|@element-plus|@vueuse|lodash-es|lodash-unified|@popperjs|@floating-ui|@ctrl|async-validator|dayjs|memoize-one|normalize-wheel-es)[\\/]/
/**
 * Beyond the entry's share, the controls of forms in two files instead of some twenty of a few hundred bytes each:
 * text boxes, buttons and the form with the helpers they import (the sign-in page needs these only), and the choice
 * lists, ticks, notices and drop-downs (their poppers) most other pages add.
 */
const EP = (names: string) => new RegExp(`[\\\\/]node_modules[\\\\/]element-plus[\\\\/]es[\\\\/]components[\\\\/](${names})[\\\\/]`)
const TEXT_INPUTS = EP('input|form|button')
const CHOICES = EP('select|option|tag|checkbox|alert|scrollbar|tooltip|popper|radio|switch|input-number')
/** Word lists the second message bundle and some pages read (each its own few hundred bytes otherwise). */
const WORDS = /[\\/](shared[\\/](familyNames|inventory[\\/]reorderWords|takeoff[\\/]explainWords))\.ts$/
/** The data grid and its words: one file, for the pages with a grid. */
const GRID = /[\\/]node_modules[\\/](ag-grid-community|ag-grid-vue3|ag-stack|@ag-grid-community)[\\/]/
/** The project's own shared code (shared/, beside src/). */
const sharedDir = fileURLToPath(new URL('./shared/', import.meta.url))

// Element Plus is imported on demand (components and their styles) through the resolvers.
export default defineConfig(({ command }) => ({
  plugins: [
    vue(),
    // The messages arrive compiled (every build, the browser tests' too): the client runs without vue-i18n's compiler.
    precompiledMessages(),
    // route-preloads.json: each page's files, named in its HTML by the server (server/http/pagePreloads.ts).
    routePreloads(),
    // The answers' schemas stay out of the production client (answers are checked in development and tests only).
    answerChecksOutOfProduction(),
    AutoImport({ resolvers: [ElementPlusResolver()], dts: 'src/auto-imports.d.ts' }),
    Components({ resolvers: [ElementPlusResolver()], dts: 'src/components.d.ts' }),
    // .gz and .br beside each file, served as they are by the server (server/app.ts): no compression per request.
    // The test run's build leaves them out (LUMENYARD_PRECOMPRESS=0): it saves the suite several seconds.
    ...(process.env.LUMENYARD_PRECOMPRESS === '0' ? [] : [compression({ algorithms: ['gzip', 'brotliCompress'], threshold: 1024 })]),
  ],
  // vue-i18n's build flags: a build leaves out its message compiler (the messages come compiled, above) and its
  // legacy API (the app uses the composition API only); the development server keeps both.
  define:
    command === 'build'
      ? { __INTLIFY_DROP_MESSAGE_COMPILER__: 'true', __VUE_I18N_LEGACY_API__: 'false', __VUE_I18N_FULL_INSTALL__: 'true', __INTLIFY_PROD_DEVTOOLS__: 'false' }
      : {},
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': { target: `http://127.0.0.1:${process.env.LUMENYARD_PORT ?? 5480}`, changeOrigin: false } },
  },
  build: {
    chunkSizeWarningLimit: 1200,
    rolldownOptions: {
      // shared/ holds definitions only (schemas, word lists, the computations), nothing that acts on import: a
      // module none of whose exports a page uses is left out with what it imports. Without this the answer
      // schemas the session module reads pulled the reorder statistics (jstat) and decimal.js into the entry.
      treeshake: { moduleSideEffects: (id: string) => (id.startsWith(sharedDir) ? false : undefined) },
      output: {
        // Fewer files for a cold load: each request queues on the browser's six connections per host. The entry's
        // share of the frameworks is one file (the sign-in page loads all of it anyway); the grid is another, asked
        // for only by the pages with a grid, and the frameworks group is first so Vue stays out of the grid's file.
        codeSplitting: {
          groups: [
            { name: 'frameworks', test: FRAMEWORKS, tags: ['$initial'], priority: 4 },
            { name: 'grid', test: GRID, priority: 3 },
            // Text inputs before choices: a choice list uses a text box, which belongs with the sign-in page's controls.
            { name: 'text-inputs', test: TEXT_INPUTS, priority: 2 },
            { name: 'choices', test: CHOICES, priority: 1 },
            { name: 'words', test: WORDS, priority: 1 },
          ],
        },
      },
    },
  },
}))
