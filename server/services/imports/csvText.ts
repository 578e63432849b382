// A small RFC 4180 reader (quoted fields, doubled quotes, CR LF or LF line ends). Ours rather than a
// package because it must stop after a row cap without reading the rest, and it is a dozen rules.

export interface CsvOptions {
  /** Stop once this many records have been read (the caller asks for cap + 1 to detect "too many"). */
  maxRecords: number
  /** Refuse a record with more fields than this. */
  maxFields: number
  delimiter?: ',' | ';' | '\t'
}

export type CsvResult =
  | { ok: true; records: string[][]; truncated: boolean }
  | { ok: false; code: 'sheet_too_many_columns'; params: { row: number; max: number }; message: string }
  | { ok: false; code: 'csv_open_quote'; params: { row: number }; message: string }

/** Guesses the delimiter from the header line: the most frequent of , ; and tab outside quotes. */
export function sniffDelimiter(text: string): ',' | ';' | '\t' {
  const firstLine = text.slice(0, text.search(/\r?\n|$/))
  const counts = ([',', ';', '\t'] as const).map((d) => [d, firstLine.split(d).length] as const)
  return counts.sort((a, b) => b[1] - a[1])[0][0]
}

export function readCsv(text: string, options: CsvOptions): CsvResult {
  const delimiter = options.delimiter ?? sniffDelimiter(text)
  const records: string[][] = []
  let record: string[] = []
  let field = ''
  let quoted = false
  let i = 0
  const endField = () => {
    record.push(field)
    field = ''
  }
  while (i < text.length) {
    const c = text[i]
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') { field += '"'; i += 2; continue }
      if (c === '"') { quoted = false; i++; continue }
      field += c
      i++
      continue
    }
    if (c === '"' && field === '') { quoted = true; i++; continue }
    if (c === delimiter) { endField(); i++; continue }
    if (c === '\r' || c === '\n') {
      endField()
      if (record.length > options.maxFields) return { ok: false, code: 'sheet_too_many_columns', params: { row: records.length + 1, max: options.maxFields }, message: `Row ${records.length + 1} has ${record.length} columns; at most ${options.maxFields} are read.` }
      if (!(record.length === 1 && record[0] === '')) records.push(record)
      record = []
      i += c === '\r' && text[i + 1] === '\n' ? 2 : 1
      if (records.length >= options.maxRecords) return { ok: true, records, truncated: i < text.length }
      continue
    }
    field += c
    i++
  }
  if (quoted) return { ok: false, code: 'csv_open_quote', params: { row: records.length + 1 }, message: `A quoted field that starts in row ${records.length + 1} never ends.` }
  if (field !== '' || record.length) {
    endField()
    if (record.length > options.maxFields) return { ok: false, code: 'sheet_too_many_columns', params: { row: records.length + 1, max: options.maxFields }, message: `Row ${records.length + 1} has ${record.length} columns; at most ${options.maxFields} are read.` }
    records.push(record)
  }
  return { ok: true, records, truncated: false }
}
