// The server's layering (DEVELOPERS.md, "Layout and layering"): routes parse, check access and call one
// service; services never see req/res. This walks the sources and fails on a route that reaches the
// database itself (TypeORM, entities, repositories, transactions, raw queries) or imports another route,
// and on a service that imports express or server/http/. There are no exceptions.
import { readdirSync, readFileSync } from 'node:fs'
import { join, relative } from 'node:path'
import { describe, expect, it } from 'vitest'

const ROOT = join(import.meta.dirname, '../..')
const sources = (dir: string) =>
  readdirSync(join(ROOT, dir), { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && e.name.endsWith('.ts'))
    .map((e) => join(e.parentPath, e.name))
    .map((path) => ({ path: relative(ROOT, path), text: readFileSync(path, 'utf8').replace(/\/\*[\s\S]*?\*\//g, '').replace(/^\s*\/\/.*$/gm, '') }))

const ROUTE_RULES: [string, RegExp][] = [
  ['imports typeorm', /from 'typeorm'/],
  ['imports an entity', /from '\.\.\/entities\//],
  ['opens a transaction', /from '\.\.\/db\/transaction\.js'|\binTransaction\(|\.transaction\(/],
  ['uses a repository or raw SQL', /\.getRepository\(|\bds\.query\(|\.manager\./],
  ['imports another route', /from '\.\/(?!index\.js)[^']+'/],
]
const SERVICE_RULES: [string, RegExp][] = [
  ['imports express', /from 'express'/],
  ['imports server/http/', /from '(?:\.\.\/)+http\//],
]

// Files allowed to break a rule, each named with what it does; the list may only shrink (it is empty: keep it so).
const KNOWN: Record<string, string[]> = {}

function breaches(files: { path: string; text: string }[], rules: [string, RegExp][]): Record<string, string[]> {
  const out: Record<string, string[]> = {}
  for (const { path, text } of files) {
    const hit = rules.filter(([, re]) => re.test(text)).map(([name]) => name)
    if (hit.length) out[path] = hit
  }
  return out
}

describe('server layering', () => {
  const routes = sources('server/routes').filter((f) => !f.path.endsWith('/index.ts'))
  const services = sources('server/services')
  const found = { ...breaches(routes, ROUTE_RULES), ...breaches(services, SERVICE_RULES) }

  it('walks the routes and services (the walk itself works)', () => {
    // common practice: an empty walk would pass the checks below
    expect(routes.length).toBeGreaterThan(20)
    expect(services.length).toBeGreaterThan(60)
    expect(breaches([{ path: 'x.ts', text: "import { User } from '../entities/User.js'" }], ROUTE_RULES)).toEqual({ 'x.ts': ['imports an entity'] })
  })

  it('no route reaches the database itself and no service sees express', () => {
    expect(found).toEqual(KNOWN)
  })

  it('the server and shared code never import the client (words both need live in shared/)', () => {
    // common practice: the server builds without the client's sources; a shared word list has one home
    const CLIENT = /from '(?:\.\.\/)+src\//
    expect(CLIENT.test("import catalogEn from '../../../src/i18n/en/catalog.js'")).toBe(true)
    const own = [...sources('server'), ...sources('shared')].filter((f) => CLIENT.test(f.text)).map((f) => f.path)
    expect(own).toEqual([])
  })

  it('LIKE wildcards are escaped in one place (server/db/likePattern.ts)', () => {
    const own = [...sources('server'), ...sources('shared')].filter((f) => /\[\\\\%_\]/.test(f.text)).map((f) => f.path)
    expect(own).toEqual(['server/db/likePattern.ts'])
  })
})
