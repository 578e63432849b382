// The child process that parses an uploaded spreadsheet: started by spreadsheetParser.ts with a small
// heap and a time limit, so a hostile file can at worst kill this process, never the server. Asked for
// chunks, it sends the typed rows a chunk at a time and reads on only once the server asks for more, so
// neither side holds the whole file's rows.
import type { ImportSpec, ParsedSheet, ParseOutcome } from './importTypes.js'
import { parseCsvRows, parseXlsxRows, streamCsvRows, type RowChunks } from './sheetRows.js'

export interface WorkerRequest {
  kind: 'xlsx' | 'csv'
  data: Uint8Array
  spec: ImportSpec
  /** Send the rows this many at a time, each after the server's 'more'; absent: all at once at the end. */
  chunkRows?: number
}

/** What the worker sends: a chunk of rows (answered by 'more'), then the outcome with the rows left. */
export type WorkerMessage = { type: 'rows'; part: ParsedSheet } | { type: 'done'; outcome: ParseOutcome }

let more: (() => void) | null = null
process.on('message', (message: unknown) => {
  if (message === 'more' && more) {
    const go = more
    more = null
    go()
  }
})

const send = (message: WorkerMessage) => new Promise<void>((resolve) => process.send!(message, undefined, {}, () => resolve()))

function chunksOf(rows: number | undefined): RowChunks | undefined {
  if (!rows) return undefined
  return {
    rows,
    // Back-pressure: the next rows are read only once the server has checked these and asks for more.
    each: (part) => new Promise<void>((resolve) => {
      more = resolve
      void send({ type: 'rows', part })
    }),
  }
}

async function parse(request: WorkerRequest): Promise<ParseOutcome> {
  const chunks = chunksOf(request.chunkRows)
  try {
    if (request.kind === 'xlsx') return await parseXlsxRows(request.data, request.spec, chunks)
    return chunks ? await streamCsvRows(request.data, request.spec, chunks) : parseCsvRows(request.data, request.spec)
  } catch {
    return { ok: false, code: 'sheet_unreadable', message: 'The workbook could not be read; it may be damaged. Save it again from the spreadsheet and retry.' }
  }
}

process.once('message', (request: WorkerRequest) => {
  parse(request).then((outcome) => send({ type: 'done', outcome })).then(() => process.exit(0))
})
