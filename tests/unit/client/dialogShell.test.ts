// One shell for every form dialog: only src/components/base/FormDialog.vue may use the component library's
// dialog. A dialog written out by hand again (its own title, footer buttons, busy flag and close handling)
// would miss what the shell guarantees: Escape and Cancel held while busy, the focus handed back to the
// opener, a second confirm ignored while the first is at work, and the problem announced inside the dialog.
// source: WAI-ARIA Authoring Practices 1.2, "Dialog (Modal) Pattern" (Tab stays inside, Escape closes, focus
// returns to the invoking element); WCAG 2.2 SC 2.4.3 Focus Order and SC 4.1.3 Status Messages.
import { describe, expect, it } from 'vitest'

// Every component, view and script of the client as text (Vite's glob import, which the unit tests run under).
const SOURCES = import.meta.glob<string>(['../../../src/**/*.vue', '../../../src/**/*.ts'], { query: '?raw', import: 'default', eager: true })
const THE_SHELL = 'src/components/base/FormDialog.vue'

/**
 * Files allowed to use the library's dialog directly, each with its reason. Empty: every dialog that asks for
 * something goes through the shell (a drawer, el-drawer, is not a dialog that asks and is not checked here).
 */
const ALLOWED: Record<string, string> = {}

/** Where a file uses the library's dialog: the tag in a template (either spelling) or the component imported. */
export function dialogUses(text: string): string[] {
  const found: string[] = []
  for (const m of text.matchAll(/<(el-dialog|ElDialog)[\s>/]/g)) found.push(m[0].trim())
  for (const m of text.matchAll(/import\s*\{[^}]*\bElDialog\b[^}]*\}\s*from\s*['"]element-plus/g)) found.push(m[0].replace(/\s+/g, ' '))
  for (const m of text.matchAll(/resolveComponent\(\s*['"](el-dialog|ElDialog)['"]/g)) found.push(m[0])
  return found
}

const files = Object.entries(SOURCES).map(([p, text]) => ({ file: p.replace(/^(\.\.\/)+/, ''), text }))

describe('one form-dialog shell', () => {
  it('reads the client and finds the shell itself using the dialog', () => {
    expect(files.length).toBeGreaterThan(100)
    const shell = files.find((f) => f.file === THE_SHELL)
    expect(shell, THE_SHELL).toBeDefined()
    expect(dialogUses(shell!.text).length).toBeGreaterThan(0)
  })

  it('finds each way of writing the dialog (checks the check)', () => {
    // common practice: Vue templates accept kebab-case and PascalCase tags; a script may import the component
    expect(dialogUses('<el-dialog v-model="open" title="x">')).toHaveLength(1)
    expect(dialogUses('<ElDialog\n  v-model="open">')).toHaveLength(1)
    expect(dialogUses("import { ElDialog, ElButton } from 'element-plus'")).toHaveLength(1)
    expect(dialogUses('<el-drawer v-model="open"><FormDialog v-model:open="x" /></el-drawer>')).toHaveLength(0)
  })

  it('no other component or view uses the library’s dialog', () => {
    const offenders = files
      .filter((f) => f.file !== THE_SHELL && !(f.file in ALLOWED))
      .flatMap((f) => dialogUses(f.text).map((use) => `${f.file}: ${use}`))
    expect(offenders, 'use src/components/base/FormDialog.vue (see DEVELOPERS.md, "Adding a form dialog")').toEqual([])
  })

  it('lists no file that no longer needs it', () => {
    for (const file of Object.keys(ALLOWED)) {
      const f = files.find((x) => x.file === file)
      expect(f && dialogUses(f.text).length, file).toBeGreaterThan(0)
    }
  })
})
