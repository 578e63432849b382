// Screens name a stock move's document as people do ("Purchase order PO-2026-00009", "Cycle count 12"), in
// English and Spanish, never by its table name ("purchase_order 9", "cycle_count"). Every document kind the
// server writes on a move (found by reading the server's source, so a new kind can't be forgotten) has
// words in both languages, and a kind the screen does not know reads as "Document 12".
import { describe, expect, it } from 'vitest'
import enStock from '@/i18n/en/stock'
import esStock from '@/i18n/es/stock'
import { documentName } from '@/components/stock/stockGrid'
import { LEDGER_DOC_KINDS } from '@/views/stock/ledgerFilters'

// The server's source and the shared code it takes document kinds from, as text (Vite's glob import, which
// the unit tests run under).
const SERVER_SOURCES = {
  ...import.meta.glob<string>('../../../server/**/*.ts', { query: '?raw', import: 'default', eager: true }),
  ...import.meta.glob<string>('../../../shared/**/*.ts', { query: '?raw', import: 'default', eager: true }),
}

/** Document kinds written on stock moves: `docType: 'x'`, `doc_type = 'x'`, `…_DOC = 'x'` in the server's and shared code. */
function docKindsWritten(): Set<string> {
  const kinds = new Set<string>()
  for (const text of Object.values(SERVER_SOURCES)) {
    for (const m of text.matchAll(/(?:docType:\s*|doc_type\s*=?\s*|_DOC\s*=\s*)'([a-z_]+)'/g)) kinds.add(m[1])
  }
  return kinds
}

const words = (messages: { docKinds: Record<string, string> }) => (key: string, fallback: string) => {
  const k = key.replace(/^stock\.docKinds\./, '')
  return key.startsWith('stock.docKinds.') && k in messages.docKinds ? messages.docKinds[k] : fallback
}

describe('document names on screens', () => {
  it('has English and Spanish words for every document kind the server writes on a move', () => {
    const kinds = docKindsWritten()
    expect(kinds.size).toBeGreaterThanOrEqual(5)
    for (const kind of kinds) {
      expect(enStock.docKinds, kind).toHaveProperty(kind)
      expect(esStock.docKinds, kind).toHaveProperty(kind)
    }
    // the movements filter offers each of them by name (it once asked for "transfer, pick_list…" typed in)
    expect([...LEDGER_DOC_KINDS].sort()).toEqual([...kinds].sort())
  })

  it('names a document by kind and number in the reader\'s language, never by a table name', () => {
    const es = words(esStock)
    const en = words(enStock)
    expect(documentName(es, { docType: 'cycle_count', docId: 12, docRef: null })).toBe('Conteo cíclico 12')
    expect(documentName(en, { docType: 'cycle_count', docId: 12, docRef: null })).toBe('Cycle count 12')
    expect(documentName(en, { docType: 'purchase_order', docId: 9, docRef: 'PO-2026-00009' })).toBe('PO-2026-00009')
    expect(documentName(en, { docType: 'purchase_order', docId: 9, docRef: null })).toBe('Purchase order 9')
    // a kind this version does not know: a plain word, no underscore, no table name
    expect(documentName(es, { docType: 'vendor_item', docId: 5, docRef: null })).toBe('Documento 5')
    expect(documentName(en, { docType: 'vendor_item', docId: 5, docRef: null })).toBe('Document 5')
  })
})
