import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'
import AutoImport from 'unplugin-auto-import/vite'
import Components from 'unplugin-vue-components/vite'
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers'
import { compression } from 'vite-plugin-compression2'
import { routePreloads } from './scripts/routePreloads'

// Element Plus is imported on demand (components and their styles) through the resolvers.
export default defineConfig({
  plugins: [
    vue(),
    // route-preloads.json: each page's files, named in its HTML by the server (server/http/pagePreloads.ts).
    routePreloads(),
    AutoImport({ resolvers: [ElementPlusResolver()], dts: 'src/auto-imports.d.ts' }),
    Components({ resolvers: [ElementPlusResolver()], dts: 'src/components.d.ts' }),
    // .gz and .br beside each file, served as they are by the server (server/app.ts): no compression per request.
    // The test run's build leaves them out (LUMENYARD_PRECOMPRESS=0): it saves the suite several seconds.
    ...(process.env.LUMENYARD_PRECOMPRESS === '0' ? [] : [compression({ algorithms: ['gzip', 'brotliCompress'], threshold: 1024 })]),
  ],
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
  build: { chunkSizeWarningLimit: 1200 },
})
