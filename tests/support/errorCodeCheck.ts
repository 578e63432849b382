// Whether an error answer carries codes the client knows: registered (shared/errors/errorCodes.ts) and
// worded in both message files. The API harness runs every error answer of every API test through it.
import { isErrorCode } from '../../shared/errors/errorCodes.js'
import en from '../../src/i18n/en/errors.js'
import es from '../../src/i18n/es/errors.js'

const worded = (code: string) =>
  isErrorCode(code) && typeof (en as Record<string, unknown>)[code] === 'string' && typeof (es as Record<string, unknown>)[code] === 'string'

/** The codes of an error body (`code`, and each field's) the client could not word; a body with no code is one too. */
export function unknownErrorCodes(body: unknown): string[] {
  const error = (body as { error?: { code?: unknown; fields?: Record<string, { code?: unknown }> } } | null)?.error
  if (!error) return []
  const found: string[] = []
  if (typeof error.code !== 'string' || !worded(error.code)) found.push(`code ${String(error.code)}`)
  for (const [field, p] of Object.entries(error.fields ?? {})) {
    if (typeof p?.code !== 'string' || !worded(p.code)) found.push(`field ${field}: ${JSON.stringify(p)}`)
  }
  return found
}
