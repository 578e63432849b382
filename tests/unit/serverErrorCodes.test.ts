// Walks every place the server and the shared checks name an error code (AppError calls, idParam's
// not-found code, problem(), issueCode() and issueOf()) and holds each to a message in English and in
// Spanish. A throw whose code is not a literal is allowed only where the code comes from a typed
// variable listed below; everything else must name its situation where it is thrown.
import { readdirSync, readFileSync } from 'node:fs'
import { join, relative } from 'node:path'
import { describe, expect, it } from 'vitest'
import en from '../../src/i18n/en/errors.js'
import es from '../../src/i18n/es/errors.js'

const ROOT = join(import.meta.dirname, '../..')

function sources(dir: string): string[] {
  return readdirSync(join(ROOT, dir), { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && e.name.endsWith('.ts'))
    .map((e) => join(e.parentPath, e.name))
}

/** The code without comments (examples in comments name codes that need no message). */
const code = (text: string) => text.replace(/\/\*[\s\S]*?\*\//g, '').replace(/^\s*\/\/.*$/gm, '')
const files = [...sources('server'), ...sources('shared')].map((path) => ({ path: relative(ROOT, path), text: code(readFileSync(path, 'utf8')) }))

// Codes named as string literals at the places that raise or word them.
const NAMED = [
  /AppError\.(?:badRequest|notFound|conflict|unprocessable|tooMany)\(\s*'([a-z0-9_]+)'/g,
  /AppError\.of\(\s*\d+,\s*'([a-z0-9_]+)'/g,
  /new AppError\(\s*\d+,\s*'([a-z0-9_]+)'/g,
  /idParam\([^()]*(?:\([^()]*\))?[^()]*,\s*'([a-z0-9_]+)'\)/g,
  /\bproblem\(\s*'([a-z0-9_]+)'/g,
  /issueCode\(\s*'([a-z0-9_]+)'/g,
  /issueOf\(\s*'([a-z0-9_]+)'/g,
]
// Every AppError raised at all, literal code or not.
const RAISED = /(?:AppError\.(?:badRequest|notFound|conflict|unprocessable|tooMany|of)|new AppError)\(/g
// Where the code is a typed variable (a union of registered codes), not a literal.
const CODE_FROM_VARIABLE = new Set([
  'server/errors.ts', // the class itself
  'server/services/picking/pickConfirmations.ts', // check.problem: PickScanProblem
  'server/services/imports/spreadsheetParser.ts', // outcome.code: the parse worker's refusal codes
  'server/services/imports/uploadGuard.ts', // refuse(code) / tooBig(code): Refusal | Excess
  'server/http/validate.ts', // idParam's notFound: NotFoundCode, named at each route
  'server/services/imports/importRuns.ts', // a check that followed another raises the first one's stored error again (its code named where first raised)
])

const named = files.flatMap(({ path, text }) => NAMED.flatMap((re) => [...text.matchAll(re)].map((m) => ({ path, code: m[1] }))))
const own = (file: Record<string, unknown>, code: string) => typeof file[code] === 'string' && (file[code] as string).trim() !== ''

describe('error codes named in server/ and shared/', () => {
  it('finds the throw sites (the walk itself works)', () => {
    // common practice: a walk that finds nothing would pass every check below
    expect(named.length).toBeGreaterThan(300)
    expect(named.some((n) => n.code === 'pick_list_status')).toBe(true)
  })

  it.each([
    ['English', en],
    ['Spanish', es],
  ])('each has a message in %s', (_lang, file) => {
    const missing = named.filter((n) => !own(file as Record<string, unknown>, n.code)).map((n) => `${n.path}: ${n.code}`)
    expect(missing).toEqual([])
  })

  it('no message is just the English text passed along', () => {
    const passThrough = named.filter((n) => /^\s*\{text\}\s*$/.test(String((es as Record<string, unknown>)[n.code] ?? '')))
    expect(passThrough.map((n) => `${n.path}: ${n.code}`)).toEqual([])
  })

  it('every AppError names its code where it is raised (or takes it from a typed variable listed here)', () => {
    const unnamed: string[] = []
    for (const { path, text } of files) {
      if (CODE_FROM_VARIABLE.has(path)) continue
      for (const m of text.matchAll(RAISED)) {
        const rest = text.slice(m.index)
        if (!NAMED.some((re) => new RegExp(`^${re.source}`).test(rest))) unnamed.push(`${path}: ${rest.slice(0, 70).replace(/\s+/g, ' ')}`)
      }
    }
    expect(unnamed).toEqual([])
  })
})
