// Text from users written into a spreadsheet must never run as a formula (OWASP "CSV Injection"):
// a cell starting with = + - @ tab, CR or LF is prefixed with a single quote, which spreadsheet
// programs show as text. Numbers and dates are written as numbers and dates, never through here.

/** The leading characters OWASP lists as formula triggers. source: OWASP, CSV Injection */
export const FORMULA_TRIGGERS: readonly string[] = ['=', '+', '-', '@', '\t', '\r', '\n']

export function needsInerting(text: string): boolean {
  return text.length > 0 && FORMULA_TRIGGERS.includes(text[0])
}

/** The text as a spreadsheet shows it safely: unchanged, or with a leading single quote. */
export function inertText(text: string): string {
  return needsInerting(text) ? `'${text}` : text
}

/** For optional values: null and undefined stay empty cells. */
export function inertCell(text: string | null | undefined): string | null {
  return text === null || text === undefined ? null : inertText(text)
}

/** One CSV field: inerted, then quoted with inner quotes doubled (RFC 4180) when it needs quoting. */
export function csvField(text: string): string {
  const safe = inertText(text)
  return /[",\r\n]/.test(safe) || safe !== text ? `"${safe.replace(/"/g, '""')}"` : safe
}
