// Text from people written into a spreadsheet must never run as a formula (OWASP "CSV Injection": a cell
// starting with = + - @ tab, CR or LF). In an .xlsx file each cell carries its type and a string cell is never
// evaluated, so the exports write every text as a string cell (exports/xlsxWriter.ts) and leave the text as
// typed: no visible quote in front, and an exported file imports back unchanged. Only formula cells run, and
// no export writes one.

/** The most characters a spreadsheet cell holds (from memory: the usual limit of spreadsheet programs). */
export const CELL_TEXT_MAX = 32_767

// Characters XML 1.0 (§2.2, Char) does not allow in a document, C0 controls other than tab, LF and CR: one
// of them in a cell makes the whole file unreadable until a spreadsheet program repairs it.
const NOT_XML = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g

/** The text as a string cell can hold it: characters XML forbids removed, at most CELL_TEXT_MAX characters. */
export function cellText(text: string): string {
  const clean = text.replace(NOT_XML, '')
  return clean.length > CELL_TEXT_MAX ? clean.slice(0, CELL_TEXT_MAX) : clean
}
