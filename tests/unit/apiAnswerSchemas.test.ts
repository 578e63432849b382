// Every call the typed API modules make (src/api/*.ts) names the schema of its answer, so the client checks
// each answer in development and the browser tests' build (src/api/client.ts, checkAnswer). This reads the
// modules' syntax tree and fails on a call to the fetch client without `answer`, on an answer typed by a bare
// type argument instead (`api.get<T>(…)`, unchecked), and on an upload without its answer's schema.
// source: common practice (a contract check at the client's edge; the schemas are held against the real
// server's answers in tests/api/answerSchemas.test.ts)
import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import ts from 'typescript'
import { describe, expect, it } from 'vitest'

const API_DIR = join(import.meta.dirname, '../../src/api')
const METHODS = new Set(['get', 'post', 'put', 'patch', 'delete'])
/** The option argument's position per method: get and delete take (path, options), the rest (path, body, options). */
const OPTIONS_AT: Record<string, number> = { get: 1, delete: 1, post: 2, put: 2, patch: 2 }

function hasAnswer(arg: ts.Expression | undefined): boolean {
  if (!arg || !ts.isObjectLiteralExpression(arg)) return false
  return arg.properties.some((p) => (ts.isPropertyAssignment(p) || ts.isShorthandPropertyAssignment(p)) && p.name.getText() === 'answer')
}

/** Calls without a checked answer in one module's source, as `name: line`. */
export function unchecked(fileName: string, text: string): string[] {
  const source = ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, true)
  const found: string[] = []
  const where = (n: ts.Node) => `${fileName}:${source.getLineAndCharacterOfPosition(n.getStart()).line + 1}`
  const visit = (node: ts.Node) => {
    if (ts.isCallExpression(node)) {
      const callee = node.expression
      if (ts.isPropertyAccessExpression(callee) && callee.expression.getText() === 'api' && METHODS.has(callee.name.text)) {
        const method = callee.name.text
        if (node.typeArguments?.length) found.push(`${where(node)} api.${method}<…> (a type argument is not checked)`)
        else if (!hasAnswer(node.arguments[OPTIONS_AT[method]])) found.push(`${where(node)} api.${method} without answer`)
      }
      if (ts.isIdentifier(callee) && callee.text === 'uploadWithProgress' && node.arguments.length < 4) {
        found.push(`${where(node)} uploadWithProgress without its answer's schema`)
      }
    }
    ts.forEachChild(node, visit)
  }
  visit(source)
  return found
}

describe("the API modules check every answer", () => {
  const modules = readdirSync(API_DIR).filter((f) => f.endsWith('.ts') && f !== 'client.ts')

  it('finds a call without a schema, with a bare type argument, and an upload without one (the check works)', () => {
    expect(unchecked('x.ts', "export const a = { one: () => api.get('/one') }")).toEqual(['x.ts:1 api.get without answer'])
    expect(unchecked('x.ts', "const b = () => api.post<Thing>('/b', {})")).toEqual(['x.ts:1 api.post<…> (a type argument is not checked)'])
    expect(unchecked('x.ts', "const c = () => api.put('/c', body, { headers: {} })")).toEqual(['x.ts:1 api.put without answer'])
    expect(unchecked('x.ts', "const d = () => uploadWithProgress('/d', form, () => {})")).toEqual(["x.ts:1 uploadWithProgress without its answer's schema"])
    expect(unchecked('x.ts', "const e = () => api.delete('/e', { answer: okShape })")).toEqual([])
    expect(unchecked('x.ts', "const f = () => api.post('/f', body, { ...keyed(key), answer: fShape })")).toEqual([])
  })

  it('every call in src/api names its answer schema', () => {
    expect(modules.length).toBeGreaterThan(10)
    const calls = modules.flatMap((f) => readFileSync(join(API_DIR, f), 'utf8').match(/\bapi\.(get|post|put|patch|delete)\(/g) ?? [])
    expect(calls.length).toBeGreaterThan(100)
    expect(modules.flatMap((f) => unchecked(f, readFileSync(join(API_DIR, f), 'utf8')))).toEqual([])
  })
})
