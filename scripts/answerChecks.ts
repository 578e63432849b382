// Build step: the production client does not carry the schemas of the server's answers. The typed API modules
// (src/api/*.ts) name each call's answer schema (`api.get(path, { answer: … })`, an upload's steps and arguments),
// which the fetch client checks only in development and in the browser tests' build (src/api/client.ts,
// checkAnswer); production passes the answer on unchecked. Yet a schema named in a call is code the bundle keeps,
// with zod and every shared schema module it reads: some 90 KB of script in the entry alone, parsed and run before
// the first page shows. In a production build this step gives each of those schemas `undefined` instead before
// anything else reads the module, so the imports go unused and the bundler leaves them out. Request schemas, which
// forms check before they send, are untouched: they are imported by the forms, not named as an answer.
// A step rather than a test of `import.meta.env` at each of the some 230 calls: that would repeat the condition in
// every call and give each answer the type `schema | undefined`. The step's source map keeps the stack traces and the
// browser's debugger on the module's own lines.
import path from 'node:path'
import MagicString from 'magic-string'
import type { Plugin } from 'vite'
import { parseAst } from 'vite'

/** The modules whose calls name answer schemas. */
export const ANSWER_MODULES = /[\\/]src[\\/]api[\\/][^\\/]+\.ts$/

interface Node {
  type: string
  start: number
  end: number
  [key: string]: unknown
}

const isNode = (v: unknown): v is Node => typeof v === 'object' && v !== null && typeof (v as Node).type === 'string'

/** The fetch client's methods (src/api/client.ts): their option argument's `answer` names the answer's schema. */
const API_METHODS = new Set(['get', 'post', 'put', 'patch', 'delete'])
/** An upload step's answer schema (src/api/fileTransfer.ts, SheetSteps). */
const STEP_ANSWER = /^(preview|commit)Answer$/

/**
 * The source with each answer schema `undefined`: the `answer` option of a call to the fetch client
 * (`api.get(path, { answer })`), an upload step's `previewAnswer` and `commitAnswer`, and `uploadWithProgress`'s third
 * argument. Any other `answer` (the client's own record of a prefetched answer, say) is left alone. The edits are made
 * on a MagicString, whose source map leads the rest of the module back to its own lines and columns.
 */
export function withoutAnswerSchemas(code: string, fileName = 'module.ts'): MagicString {
  const program = parseAst(code, { lang: fileName.endsWith('.ts') ? 'ts' : 'js' }, fileName) as unknown as Node
  const edits: { start: number; end: number; text: string }[] = []
  const blank = (property: Node) => {
    const name = (property.key as Node).name as string
    // `{ answer }` (shorthand) becomes `{ answer: undefined }`; `{ answer: schema }` keeps its key.
    if (property.shorthand) edits.push({ start: property.start, end: property.end, text: `${name}: undefined` })
    else edits.push({ start: (property.value as Node).start, end: (property.value as Node).end, text: 'undefined' })
  }
  const keyOf = (n: Node) => (n.type === 'Property' && !n.computed && isNode(n.key) && n.key.type === 'Identifier' ? (n.key.name as string) : null)
  const visit = (node: Node) => {
    const callee = node.callee as Node | undefined
    const args = (node.arguments ?? []) as Node[]
    if (node.type === 'CallExpression' && isNode(callee)) {
      const object = callee.object as Node | undefined
      const property = callee.property as Node | undefined
      if (callee.type === 'MemberExpression' && object?.type === 'Identifier' && object.name === 'api' && property?.type === 'Identifier' && API_METHODS.has(property.name as string)) {
        for (const arg of args) {
          if (arg.type !== 'ObjectExpression') continue
          for (const p of arg.properties as Node[]) if (keyOf(p) === 'answer') blank(p)
        }
      }
      if (callee.type === 'Identifier' && callee.name === 'uploadWithProgress' && args[2]) edits.push({ start: args[2].start, end: args[2].end, text: 'undefined' })
    }
    if (STEP_ANSWER.test(keyOf(node) ?? '')) blank(node)
    for (const [key, value] of Object.entries(node)) {
      if (key === 'parent') continue
      if (Array.isArray(value)) value.forEach((v) => isNode(v) && visit(v))
      else if (isNode(value)) visit(value)
    }
  }
  visit(program)
  const out = new MagicString(code)
  for (const e of edits) out.overwrite(e.start, e.end, e.text)
  return out
}

/**
 * Active in a production build only: `vite` (development) and `vite build --mode test` (the browser tests) keep
 * the schemas, as src/api/client.ts checks answers there.
 */
export function answerChecksOutOfProduction(): Plugin {
  let active = false
  return {
    name: 'lumenyard:answer-checks-out-of-production',
    enforce: 'pre',
    configResolved(config) {
      active = config.command === 'build' && config.mode !== 'test' && config.mode !== 'development'
    },
    transform(code, id) {
      if (!active || !ANSWER_MODULES.test(id)) return null
      const out = withoutAnswerSchemas(code, path.basename(id))
      return { code: out.toString(), map: out.generateMap({ source: id, includeContent: true, hires: true }) }
    },
  }
}
