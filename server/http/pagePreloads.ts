// A page's HTML names the files that page needs (its view, the chunks that view imports, their styles) as
// <link rel="modulepreload"> and <link rel="preload" as="style">, so the browser fetches them side by side
// with the entry rather than after the entry has run and the router has reached the page's import(). The
// list per route is written by the build (scripts/routePreloads.ts) to route-preloads.json beside index.html.
// For a signed-in visitor it also names what every signed-in page waits for before it shows (the session, the
// English messages, which are every language's fallback) and the page's own opening data (shared/pageData.ts)
// as <link rel="preload" as="fetch">: those requests leave with the HTML instead of after the scripts have run.
import { existsSync, readFileSync, statSync } from 'node:fs'
import path from 'node:path'
import { openingData, type PageQuery } from '../../shared/pageData.js'

/** The build's list beside index.html (written by scripts/routePreloads.ts). */
export const ROUTE_PRELOADS_FILE = 'route-preloads.json'

/** Each page's paths with the scripts and styles it needs beyond the entry. */
export interface RoutePreloads {
  routes: { paths: string[]; scripts: string[]; styles: string[] }[]
  /** What every signed-in page loads beyond the entry whatever the page (the English messages). */
  signedIn?: { scripts: string[] }
}

/** The session answer every signed-in page waits for (src/stores/session.ts), as the page asks for it. */
export const SESSION_PATH = '/api/session'

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
function readBuild(dist: string): { page: (requestPath: string) => string; signedIn: string[] } {
  const index = readFileSync(path.join(dist, 'index.html'), 'utf8')
  const listFile = path.join(dist, ROUTE_PRELOADS_FILE)
  if (!existsSync(listFile) || !index.includes('</head>')) return { page: () => index, signedIn: [] }
  const list = JSON.parse(readFileSync(listFile, 'utf8')) as RoutePreloads
  const modules = (files: string[]) => files.filter((f) => FILE_NAME.test(f)).map((f) => `<link rel="modulepreload" crossorigin href="${f}">`)
  const pages = list.routes.map((r) => {
    const links = [...modules(r.scripts), ...r.styles.filter((f) => FILE_NAME.test(f)).map((f) => `<link rel="preload" as="style" crossorigin href="${f}">`)]
    return { patterns: r.paths.map(pathPattern), html: index.replace('</head>', `    ${links.join('\n    ')}\n  </head>`) }
  })
  return { page: (requestPath) => pages.find((p) => p.patterns.some((re) => re.test(requestPath)))?.html ?? index, signedIn: modules(list.signedIn?.scripts ?? []) }
}

const attribute = (s: string) => s.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;')

/**
 * The requests a signed-in visitor's page starts ahead of its entry script, so they are asked for first: the
 * session and the page's opening data (crossorigin: the same mode and credentials as the client's fetch, so its
 * fetch takes the preloaded answer instead of asking again).
 */
function dataLinks(requestPath: string, query: PageQuery): string {
  const data = [SESSION_PATH, ...openingData(requestPath, query).map((p) => `/api${p}`)]
  return data.map((p) => `<link rel="preload" as="fetch" crossorigin href="${attribute(p)}">\n    `).join('')
}

/**
 * index.html for each page: as it is for a visitor without a session; for a signed-in visitor with the page's
 * own files (where the build listed the page) and what every signed-in page waits for. Read again when a new
 * build replaces index.html (its hashed file names change with every build).
 */
export function pageHtml(dist: string): (requestPath: string, signedIn?: { query: PageQuery }) => string {
  const indexFile = path.join(dist, 'index.html')
  let built = { at: -1, build: { page: (_: string) => '', signedIn: [] as string[] } }
  return (requestPath, signedIn) => {
    const at = statSync(indexFile).mtimeMs
    if (at !== built.at) built = { at, build: readBuild(dist) }
    if (!signedIn) return built.build.page('')
    // The English messages after the page's own code (they are needed only once that has run), the data first.
    const page = built.build.page(requestPath)
    const html = built.build.signedIn.length ? page.replace('</head>', `  ${built.build.signedIn.join('\n    ')}\n  </head>`) : page
    const data = dataLinks(requestPath, signedIn.query)
    const entry = html.search(/<script\b[^>]*type="module"/)
    return entry < 0 ? html.replace('</head>', `  ${data}</head>`) : html.slice(0, entry) + data + html.slice(entry)
  }
}
