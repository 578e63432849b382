// A page's HTML names the files that page needs (its view, the chunks that view imports, their styles) as
// <link rel="modulepreload"> and <link rel="preload" as="style">, so the browser fetches them side by side
// with the entry rather than after the entry has run and the router has reached the page's import(). The
// list per route is written by the build (scripts/routePreloads.ts) to route-preloads.json beside index.html.
import { existsSync, readFileSync, statSync } from 'node:fs'
import path from 'node:path'

/** The build's list beside index.html (written by scripts/routePreloads.ts). */
export const ROUTE_PRELOADS_FILE = 'route-preloads.json'

/** Each page's paths with the scripts and styles it needs beyond the entry. */
export interface RoutePreloads {
  routes: { paths: string[]; scripts: string[]; styles: string[] }[]
}

const escapeRegExp = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')

/** '/counter/jobs/:id(\\d+)' → a pattern for the path of a request: a parameter is one segment, of its own pattern if given. */
function pathPattern(route: string): RegExp {
  const parts = route.split('/').map((seg) => {
    const param = /^:\w+(?:\((.+)\))?$/.exec(seg)
    return param ? `(?:${param[1] ?? '[^/]+'})` : escapeRegExp(seg)
  })
  return new RegExp(`^${parts.join('/')}/?$`)
}

const FILE_NAME = /^\/assets\/[\w.-]+\.(js|css)$/

/** The pages of one build: index.html with each listed page's links, and index.html as it is. */
function readBuild(dist: string): (requestPath: string) => string {
  const index = readFileSync(path.join(dist, 'index.html'), 'utf8')
  const listFile = path.join(dist, ROUTE_PRELOADS_FILE)
  if (!existsSync(listFile) || !index.includes('</head>')) return () => index
  const list = JSON.parse(readFileSync(listFile, 'utf8')) as RoutePreloads
  const pages = list.routes.map((r) => {
    const links = [
      ...r.scripts.filter((f) => FILE_NAME.test(f)).map((f) => `<link rel="modulepreload" crossorigin href="${f}">`),
      ...r.styles.filter((f) => FILE_NAME.test(f)).map((f) => `<link rel="preload" as="style" crossorigin href="${f}">`),
    ]
    return { patterns: r.paths.map(pathPattern), html: index.replace('</head>', `    ${links.join('\n    ')}\n  </head>`) }
  })
  return (requestPath) => pages.find((p) => p.patterns.some((re) => re.test(requestPath)))?.html ?? index
}

/**
 * index.html for each page: with its own preload links where the build listed the page, as it is otherwise.
 * Read again when a new build replaces index.html (its hashed file names change with every build).
 */
export function pageHtml(dist: string): (requestPath: string) => string {
  const indexFile = path.join(dist, 'index.html')
  let built = { at: -1, page: (_: string) => '' }
  return (requestPath) => {
    const at = statSync(indexFile).mtimeMs
    if (at !== built.at) built = { at, page: readBuild(dist) }
    return built.page(requestPath)
  }
}
