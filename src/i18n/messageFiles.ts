/** A language's message files as `import.meta.glob` gives them, keyed by area (the file's name). */
export type Messages = Record<string, unknown>

export function byArea(modules: Record<string, { default: Messages }>): Record<string, Messages> {
  return Object.fromEntries(Object.entries(modules).map(([file, mod]) => [file.replace(/^.*\/([^/]+)\.ts$/, '$1'), mod.default]))
}
