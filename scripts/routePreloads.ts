// Build step: which files each page of the client needs beyond the entry, so the server can name them in the
// page's HTML (<link rel="modulepreload">) and the browser fetches them while the entry is still loading,
// instead of after it has run, the router has started and the page's import() has been reached.
//
// The pages come from the client's own route table (src/router/index.ts and src/router/areas/*.ts): each route
// record's `path:` (and `alias:`) followed by its `component: () => import('@/views/…')`. Beside them, the
// English message bundles, which every signed-in page loads (English is every language's fallback,
// src/i18n/index.ts). Written to route-preloads.json beside index.html; server/http/pagePreloads.ts reads it.
import { readdirSync, readFileSync } from 'node:fs'
import path from 'node:path'
import type { Plugin } from 'vite'
import { ROUTE_PRELOADS_FILE, type RoutePreloads } from '../server/http/pagePreloads.js'

/** Each lazily loaded view of the route table with the paths that show it, in the table's order. */
export function routeViews(root: string): { paths: string[]; view: string }[] {
  const dir = path.join(root, 'src/router')
  const files = [path.join(dir, 'index.ts'), ...readdirSync(path.join(dir, 'areas')).filter((f) => f.endsWith('.ts')).map((f) => path.join(dir, 'areas', f))]
  const out: { paths: string[]; view: string }[] = []
  const token = /\b(path|alias):\s*'([^']+)'|import\('@\/(views\/[^']+)'\)/g
  for (const file of files) {
    let pending: string[] = []
    for (const m of readFileSync(file, 'utf8').matchAll(token)) {
      // The string as the router reads it ('\\d' in the source is \d); the catch-all (.*) is no page.
      const value = m[2]?.replace(/\\\\/g, '\\')
      if (m[1] === 'path') pending = [value]
      else if (m[1] === 'alias') pending.push(value)
      else {
        const paths = pending.filter((p) => p.startsWith('/') && !p.includes('(.*)'))
        if (paths.length) out.push({ paths, view: path.join(root, 'src', m[3]) })
        pending = []
      }
    }
  }
  return out
}

/** The message bundles every signed-in page loads whatever its language: English's, the fallback (src/i18n/index.ts). */
export const FALLBACK_MESSAGE_BUNDLES = ['src/i18n/bundles/enBoot.ts', 'src/i18n/bundles/enRest.ts']

export function routePreloads(): Plugin {
  let root = process.cwd()
  return {
    name: 'lumenyard-route-preloads',
    apply: 'build',
    configResolved(config) {
      root = config.root
    },
    generateBundle(_options, bundle) {
      const chunks = Object.values(bundle).flatMap((c) => (c.type === 'chunk' ? [c] : []))
      const byFile = new Map(chunks.map((c) => [c.fileName, c]))
      /** A chunk and every chunk it imports statically, with their CSS. */
      const closure = (start: string[]) => {
        const scripts = new Set<string>()
        const styles = new Set<string>()
        const stack = [...start]
        while (stack.length) {
          const file = stack.pop()!
          if (scripts.has(file)) continue
          scripts.add(file)
          const chunk = byFile.get(file)
          for (const css of chunk?.viteMetadata?.importedCss ?? []) styles.add(css)
          stack.push(...(chunk?.imports ?? []))
        }
        return { scripts, styles }
      }
      const entry = closure(chunks.filter((c) => c.isEntry).map((c) => c.fileName))
      const routes: RoutePreloads['routes'] = []
      for (const { paths, view } of routeViews(root)) {
        const chunk = chunks.find((c) => c.isDynamicEntry && c.facadeModuleId === view)
        if (!chunk) continue
        const own = closure([chunk.fileName])
        routes.push({
          paths,
          scripts: [...own.scripts].filter((f) => !entry.scripts.has(f)).map((f) => '/' + f),
          styles: [...own.styles].filter((f) => !entry.styles.has(f)).map((f) => '/' + f),
        })
      }
      const messages = closure(chunks.filter((c) => c.isDynamicEntry && FALLBACK_MESSAGE_BUNDLES.some((f) => c.facadeModuleId === path.join(root, f))).map((c) => c.fileName))
      const preloads: RoutePreloads = { routes, signedIn: { scripts: [...messages.scripts].filter((f) => !entry.scripts.has(f)).map((f) => '/' + f) } }
      this.emitFile({ type: 'asset', fileName: ROUTE_PRELOADS_FILE, source: JSON.stringify(preloads) })
    },
  }
}
