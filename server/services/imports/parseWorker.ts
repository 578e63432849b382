// The child process that parses an uploaded spreadsheet: started by spreadsheetParser.ts with a small
// heap and a time limit, so a hostile file can at worst kill this process, never the server.
import type { ImportSpec, ParseOutcome } from './importTypes.js'
import { parseCsvRows, parseXlsxRows } from './sheetRows.js'

export interface WorkerRequest {
  kind: 'xlsx' | 'csv'
  data: Uint8Array
  spec: ImportSpec
}

async function parse(request: WorkerRequest): Promise<ParseOutcome> {
  try {
    return request.kind === 'csv' ? parseCsvRows(request.data, request.spec) : await parseXlsxRows(request.data, request.spec)
  } catch {
    return { ok: false, code: 'sheet_unreadable', message: 'The workbook could not be read; it may be damaged. Save it again from the spreadsheet and retry.' }
  }
}

process.once('message', (request: WorkerRequest) => {
  parse(request).then((outcome) => process.send!(outcome, undefined, {}, () => process.exit(0)))
})
