// Raw query values as the API sends them. The pool runs with timezone 'Z', so DATE columns arrive as
// UTC-midnight Dates (or text) and DATETIMEs as UTC instants.

export const isoInstant = (d: Date | string | null | undefined): string | null => (d ? new Date(d).toISOString() : null)

export function isoDay(d: Date | string | null | undefined): string | null {
  if (!d) return null
  return typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10)
}

