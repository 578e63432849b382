// The floor pages: the least a page built with Lumenyard's frameworks must load to show a sign-in form
// (Vue, Vue Router, Pinia, vue-i18n, Element Plus) or the first rows of a stock grid (Vue, AG Grid with
// the same modules, Element Plus). Built by the bench runner, pre-compressed like Lumenyard's client.
import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'
import Components from 'unplugin-vue-components/vite'
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers'
import { compression } from 'vite-plugin-compression2'

const here = fileURLToPath(new URL('.', import.meta.url))

export default defineConfig({
  root: here,
  base: '/',
  logLevel: 'error',
  plugins: [vue(), Components({ resolvers: [ElementPlusResolver()], dts: false }), compression({ algorithms: ['gzip', 'brotliCompress'], threshold: 1024 })],
  build: {
    emptyOutDir: true,
    chunkSizeWarningLimit: 2000,
    rollupOptions: { input: { signin: `${here}signin.html`, grid: `${here}grid.html` } },
  },
})
