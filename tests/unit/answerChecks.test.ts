// The production build leaves the answers' schemas out of the client (scripts/answerChecks.ts): every `answer:`
// option of the typed API modules (and an upload step's `previewAnswer:`, `commitAnswer:`, an upload's third
// argument) loses its schema, so nothing but a type refers to the answer schema modules and
// the bundler drops them with zod; the rest of each module is untouched, and development and the browser tests'
// build keep their checks; the step's source map leads the output back to the source. The result is read back
// with the TypeScript compiler's own parser, not the one the step uses.
// source: common practice (dead-code elimination of unused imports; ECMAScript modules, ECMA-262 §16.2)
import { readdirSync, readFileSync } from 'node:fs'
import { SourceMap } from 'node:module'
import { join } from 'node:path'
import ts from 'typescript'
import type { ResolvedConfig } from 'vite'
import { describe, expect, it } from 'vitest'
import { answerChecksOutOfProduction, withoutAnswerSchemas } from '../../scripts/answerChecks.js'

const API_DIR = join(import.meta.dirname, '../../src/api')
const apiModules = readdirSync(API_DIR).filter((f) => f.endsWith('.ts')).map((f) => ({ name: f, text: readFileSync(join(API_DIR, f), 'utf8') }))

const METHODS = new Set(['get', 'post', 'put', 'patch', 'delete'])

/**
 * Each answer schema the source names, as TypeScript reads it: the `answer` option of a call to the fetch client
 * (`api.get(path, { answer })`), an upload step's `previewAnswer` or `commitAnswer`, an upload's third argument.
 */
function answerValues(fileName: string, text: string): string[] {
  const source = ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, true)
  const out: string[] = []
  const valueOf = (p: ts.ObjectLiteralElementLike) => (ts.isPropertyAssignment(p) ? p.initializer.getText(source) : p.name!.getText(source))
  const visit = (node: ts.Node) => {
    if (ts.isCallExpression(node)) {
      const callee = node.expression
      if (ts.isPropertyAccessExpression(callee) && callee.expression.getText(source) === 'api' && METHODS.has(callee.name.text)) {
        for (const arg of node.arguments) {
          if (ts.isObjectLiteralExpression(arg)) for (const p of arg.properties) if (p.name?.getText(source) === 'answer') out.push(valueOf(p))
        }
      }
      if (callee.getText(source) === 'uploadWithProgress') out.push(node.arguments[2].getText(source))
    }
    if ((ts.isPropertyAssignment(node) || ts.isShorthandPropertyAssignment(node)) && /^(preview|commit)Answer$/.test(node.name.getText(source))) out.push(valueOf(node))
    ts.forEachChild(node, visit)
  }
  visit(source)
  return out
}

/** Names imported as values from an answer schema module that the rest of the source still refers to. */
function answerSchemasStillUsed(fileName: string, text: string): string[] {
  const source = ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, true)
  const imported = new Set<string>()
  for (const st of source.statements) {
    if (!ts.isImportDeclaration(st) || st.importClause?.isTypeOnly) continue
    if (!/\/schemas\/answers\//.test((st.moduleSpecifier as ts.StringLiteral).text)) continue
    const named = st.importClause?.namedBindings
    if (named && ts.isNamedImports(named)) for (const el of named.elements) if (!el.isTypeOnly) imported.add(el.name.text)
  }
  const used = new Set<string>()
  const visit = (node: ts.Node) => {
    if (ts.isImportDeclaration(node) || ts.isTypeNode(node)) return
    if (ts.isIdentifier(node) && imported.has(node.text)) used.add(node.text)
    ts.forEachChild(node, visit)
  }
  visit(source)
  return [...used]
}

describe('answer schemas out of the production client', () => {
  it('gives every answer option of the API modules no schema, and leaves the answer schema imports unused', () => {
    let answers = 0
    for (const { name, text } of apiModules) {
      const before = answerValues(name, text)
      answers += before.length
      const after = withoutAnswerSchemas(text, name).toString()
      // As many answer options as before, each now undefined.
      expect(answerValues(name, after), name).toEqual(before.map(() => 'undefined'))
      expect(answerSchemasStillUsed(name, after), name).toEqual([])
    }
    // The modules do name their answers (tests/unit/apiAnswerSchemas.test.ts requires it): the check is not vacuous.
    expect(answers).toBeGreaterThan(150)
    expect(answerSchemasStillUsed('stock.ts', apiModules.find((m) => m.name === 'stock.ts')!.text).length).toBeGreaterThan(0)
  })

  it('leaves the fetch client itself as it is (its record of a prefetched answer is no schema)', () => {
    const client = apiModules.find((m) => m.name === 'client.ts')!.text
    expect(client).toMatch(/\{ at: Date\.now\(\), answer \}/)
    expect(withoutAnswerSchemas(client, 'client.ts').toString()).toBe(client)
  })

  it('changes nothing else: other properties, other objects’ answer, strings, comments; a shorthand answer too', () => {
    const source = [
      "// the answer: stays in a comment; é — ü before, so offsets count characters",
      "const label = 'answer: kept'",
      "export const x = (q: Q) => api.get(`/a${q}`, { quiet401: true, answer: z.array(rowShape), signal })",
      'const y = api.post(`/b`, body, { answer, other: answerShape, ...keyed(k) })',
      'const kept = { answer: deep.shape, at: 1 }; early.set(path, { at: 1, answer })',
      "const steps = { path: (w) => `/x/${w}`, previewAnswer: previewShape, commitAnswer: z.array(rowShape), answers: 3 }",
      "const done = uploadWithProgress('/setup/logo', form, okShape, () => {}).done",
    ].join('\n')
    expect(withoutAnswerSchemas(source, 'x.ts').toString()).toBe([
      "// the answer: stays in a comment; é — ü before, so offsets count characters",
      "const label = 'answer: kept'",
      "export const x = (q: Q) => api.get(`/a${q}`, { quiet401: true, answer: undefined, signal })",
      'const y = api.post(`/b`, body, { answer: undefined, other: answerShape, ...keyed(k) })',
      'const kept = { answer: deep.shape, at: 1 }; early.set(path, { at: 1, answer })',
      "const steps = { path: (w) => `/x/${w}`, previewAnswer: undefined, commitAnswer: undefined, answers: 3 }",
      "const done = uploadWithProgress('/setup/logo', form, undefined, () => {}).done",
    ].join('\n'))
  })

  it('gives a source map that leads the code after each edit back to its own line and column', () => {
    const text = apiModules.find((m) => m.name === 'stock.ts')!.text
    const plugin = answerChecksOutOfProduction()
    ;(plugin.configResolved as (c: ResolvedConfig) => void)({ command: 'build', mode: 'production' } as ResolvedConfig)
    const out = (plugin.transform as (code: string, id: string) => { code: string; map: object })(text, join(API_DIR, 'stock.ts'))
    // Node's own reader of source maps (node:module SourceMap, Source Map Revision 3), not the step's writer.
    // source: Source Map Revision 3 Proposal (mappings: generated line and column to original line and column)
    const map = new SourceMap(out.map as ConstructorParameters<typeof SourceMap>[0])
    // The last character of each line of the output, traced back, is the same character in the source.
    const source = text.split('\n')
    const wrong: string[] = []
    let moved = 0
    for (const [line, generated] of out.code.split('\n').entries()) {
      const column = generated.trimEnd().length - 1
      if (column < 0) continue
      const entry = map.findEntry(line, column) as { originalLine: number; originalColumn: number }
      if (source[entry.originalLine]?.[entry.originalColumn] !== generated[column]) wrong.push(`${line + 1}: ${generated}`)
      if (entry.originalColumn !== column || entry.originalLine !== line) moved++
    }
    expect(wrong).toEqual([])
    // The edits do shift code (a schema's name is longer or shorter than `undefined`): the map is needed.
    expect(moved).toBeGreaterThan(0)
  })

  it('acts in a production build only: development and the browser tests’ build keep the checks', () => {
    const transformed = (command: 'build' | 'serve', mode: string, id = join(API_DIR, 'stock.ts')) => {
      const plugin = answerChecksOutOfProduction()
      ;(plugin.configResolved as (c: ResolvedConfig) => void)({ command, mode } as ResolvedConfig)
      const transform = plugin.transform as (code: string, id: string) => { code: string } | null
      return transform(apiModules.find((m) => m.name === 'stock.ts')!.text, id)
    }
    expect(transformed('build', 'production')?.code).toContain('answer: undefined')
    expect(transformed('build', 'test')).toBeNull()
    expect(transformed('build', 'development')).toBeNull()
    expect(transformed('serve', 'development')).toBeNull()
    // Only the API modules: a view's own `answer` data is none of its business.
    expect(transformed('build', 'production', join(API_DIR, '../views/SomeView.vue'))).toBeNull()
  })
})
