// A PDF's text as an outside reader sees it: poppler's pdftotext (Debian's poppler-utils).
import { execFile } from 'node:child_process'
import { mkdtemp, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { promisify } from 'node:util'

export async function pdfText(bytes: Buffer): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), 'ly-pdf-'))
  try {
    await writeFile(path.join(dir, 'doc.pdf'), bytes)
    const { stdout } = await promisify(execFile)('pdftotext', ['-enc', 'UTF-8', path.join(dir, 'doc.pdf'), '-'])
    return stdout
  } finally {
    await rm(dir, { recursive: true, force: true })
  }
}
