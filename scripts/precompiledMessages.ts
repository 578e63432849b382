// Build step: the messages arrive compiled, so the client ships without vue-i18n's message compiler (its parser
// and code generator, parsed and run before the first page shows). Each message file (src/i18n/<language>/<area>.ts)
// is loaded here in Node and its text turned into the message syntax tree vue-i18n evaluates at run time; plain text
// with none of the syntax's characters stays text, which vue-i18n shows as it is. A message that does not parse fails
// the build. `__INTLIFY_DROP_MESSAGE_COMPILER__` (vite.config.ts) then lets the bundler leave the compiler out.
// The development server and the unit tests read the files as written and compile them in the browser.
import { pathToFileURL } from 'node:url'
import { baseCompile } from '@intlify/message-compiler'
import { tsImport } from 'tsx/esm/api'
import type { Plugin } from 'vite'

/** One language's message file for one area. */
export const MESSAGE_FILES = /[\\/]src[\\/]i18n[\\/](en|es)[\\/][^\\/]+\.ts$/

/** The characters of the message syntax: placeholders `{…}`, linked messages `@:`, plural forms `|`. */
const SYNTAX = /[{}@|]/

/** A message file's value with each message compiled; `where` names the key in an error (`en:stock.overview.title`). */
export function precompile(value: unknown, where: string): unknown {
  if (typeof value === 'string') {
    if (!SYNTAX.test(value)) return value
    const errors: string[] = []
    const { ast } = baseCompile(value, { jit: true, minify: true, location: false, onError: (e) => errors.push(e.message) })
    if (errors.length) throw new Error(`The message ${where} does not parse: ${errors.join('; ')}`)
    return ast
  }
  if (Array.isArray(value)) return value.map((v, i) => precompile(v, `${where}.${i}`))
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, precompile(v, `${where}.${k}`)]))
  }
  throw new Error(`The message ${where} is a ${typeof value}, not text`)
}

/** Every build (production, and the browser tests' build in test mode); not the development server. */
export function precompiledMessages(): Plugin {
  return {
    name: 'lumenyard:precompiled-messages',
    apply: 'build',
    enforce: 'pre',
    async load(id) {
      if (!MESSAGE_FILES.test(id)) return null
      const file = id.replace(/\?.*$/, '')
      const mod = (await tsImport(pathToFileURL(file).href, import.meta.url)) as { default: unknown }
      const [, language, area] = /([a-z]+)[\\/]([^\\/]+)\.ts$/.exec(file)!
      // JSON.parse of a string: the script parser skims the text once, instead of building a large object literal.
      const json = JSON.stringify(precompile(mod.default, `${language}:${area}`))
      return { code: `export default JSON.parse(${JSON.stringify(json)})\n`, map: { mappings: '' } }
    },
  }
}
