// Parses a guarded upload in a child process (parseWorker.ts) with a heap cap and a timeout: the
// column spec goes in, typed rows and per-row issues come out. Reusable by any import.
import { fork } from 'node:child_process'
import { existsSync } from 'node:fs'
import { createRequire } from 'node:module'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import yauzl from 'yauzl'
import { AppError } from '../../errors.js'
import type { ImportSpec, ParsedSheet, ParseOutcome, RefusalCode } from './importTypes.js'
import type { GuardedUpload } from './uploadGuard.js'
import type { WorkerMessage, WorkerRequest } from './parseWorker.js'
import { parseCsvRows } from './sheetRows.js'

export interface ParseLimits {
  timeoutMs: number
  heapMb: number
}

export const DEFAULT_PARSE_LIMITS: ParseLimits = { timeoutMs: 30_000, heapMb: 128 }

const here = import.meta.dirname
const workerFile = existsSync(path.join(here, 'parseWorker.ts')) ? path.join(here, 'parseWorker.ts') : path.join(here, 'parseWorker.js')
// The worker is TypeScript run through tsx's loader, resolved absolutely so the working directory does not matter.
const tsxLoader = pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href
const serverTsconfig = path.resolve(here, '..', '..', '..', 'tsconfig.server.json')

/**
 * Runs the worker once; resolves with its outcome, or a refusal when it ran out of time or memory. With `onRows`
 * the worker sends its rows a chunk at a time (request.chunkRows) and reads on only once `onRows` has taken a
 * chunk; the time limit counts the worker's own reading, not the time the server spends on each chunk. A throw
 * from `onRows` stops the worker and rejects.
 */
export function parseInChild(request: WorkerRequest, limits: ParseLimits = DEFAULT_PARSE_LIMITS, onRows?: (part: ParsedSheet) => Promise<void>): Promise<ParseOutcome> {
  return new Promise((resolve, reject) => {
    const child = fork(workerFile, [], {
      execPath: process.execPath,
      execArgv: [`--max-old-space-size=${limits.heapMb}`, '--import', tsxLoader],
      // Only what the loader needs: the parser never sees the server's secrets.
      env: { PATH: process.env.PATH ?? '', NODE_ENV: process.env.NODE_ENV ?? 'production', TSX_TSCONFIG_PATH: serverTsconfig },
      serialization: 'advanced',
      stdio: ['ignore', 'ignore', 'pipe', 'ipc'],
    })
    let stderr = ''
    let done = false
    let timer: NodeJS.Timeout | undefined
    let budget = limits.timeoutMs
    let since = Date.now()
    const stop = () => {
      done = true
      clearTimeout(timer)
      if (child.exitCode === null) child.kill('SIGKILL')
    }
    const finish = (outcome: ParseOutcome) => {
      if (done) return
      stop()
      resolve(outcome)
    }
    const runClock = () => {
      since = Date.now()
      timer = setTimeout(() => finish({ ok: false, code: 'sheet_timeout', message: 'Reading the file took too long; it was stopped. Split it into smaller files.' }), budget)
    }
    runClock()
    child.stderr?.on('data', (chunk: Buffer) => { stderr = (stderr + chunk.toString()).slice(-4000) })
    child.on('message', (message: WorkerMessage) => {
      if (done) return
      if (message.type === 'done') return finish(message.outcome)
      // A chunk: the clock stops while the server works on it, and the worker waits for 'more'.
      clearTimeout(timer)
      budget -= Date.now() - since
      const take = onRows ? onRows(message.part) : Promise.reject(new Error('rows sent in chunks nobody asked for'))
      take.then(() => {
        if (done) return
        runClock()
        child.send('more')
      }, (err: unknown) => {
        if (done) return
        stop()
        reject(err)
      })
    })
    child.on('error', () => finish({ ok: false, code: 'sheet_unreadable', message: 'The file could not be read.' }))
    child.on('exit', () => {
      const memory = /heap out of memory|Allocation failed/i.test(stderr)
      finish(memory
        ? { ok: false, code: 'sheet_too_big', message: 'The file needs more memory to read than an upload may use; split it into smaller files.' }
        : { ok: false, code: 'sheet_unreadable', message: 'The file could not be read; it may be damaged.' })
    })
    child.send({ ...request, data: new Uint8Array(request.data), chunkRows: onRows ? request.chunkRows ?? SHEET_CHUNK_ROWS : undefined })
  })
}

/** Rows that cross from the parse worker to the server at a time, when read in chunks. */
export const SHEET_CHUNK_ROWS = 2_000

/** CSV files up to this size are parsed in the server's process. */
export const IN_PROCESS_CSV_BYTES = 64 * 1024

const STATUS: Record<RefusalCode, number> = {
  sheet_empty: 422, sheet_columns: 422, sheet_too_many_rows: 413, sheet_too_many_columns: 422, csv_open_quote: 422, sheet_unreadable: 422, sheet_timeout: 422, sheet_too_big: 413,
}

const refusal = (outcome: Extract<ParseOutcome, { ok: false }>) => new AppError(STATUS[outcome.code], outcome.code, outcome.message, { params: outcome.params })

/** The upload's rows against the spec; a file that cannot be read as a whole becomes an AppError. */
export async function parseSpreadsheet(upload: GuardedUpload, spec: ImportSpec, limits?: ParseLimits): Promise<ParsedSheet> {
  // A small CSV is plain text read in one linear pass: nothing in it can blow up, so it is read here
  // rather than paying a child process's start (seconds on a loaded machine) for every short sheet.
  const outcome = upload.kind === 'csv' && upload.data.length <= IN_PROCESS_CSV_BYTES
    ? parseCsvRows(upload.data, spec)
    : await parseInChild({ kind: upload.kind, data: upload.data, spec }, limits)
  if (!outcome.ok) throw refusal(outcome)
  return outcome.sheet
}

/**
 * The upload's rows against the spec, handed to `each` a chunk at a time (in sheet order, each row with its own
 * issues); the reading waits while `each` works, so memory follows the chunk, not the file. A file that cannot be
 * read as a whole becomes an AppError (after the chunks read before the problem was found). Answers the rows read.
 * `chunkRows` is SHEET_CHUNK_ROWS unless said (tests make it small, to put related rows on both sides of a chunk's end).
 */
export async function readSpreadsheetInChunks(
  upload: GuardedUpload, spec: ImportSpec, each: (part: ParsedSheet) => Promise<void>, limits?: ParseLimits, chunkRows = SHEET_CHUNK_ROWS,
): Promise<number> {
  let rows = 0
  const take = async (part: ParsedSheet) => {
    rows += part.rows.length
    await each(part)
  }
  if (upload.kind === 'csv' && upload.data.length <= IN_PROCESS_CSV_BYTES) {
    const outcome = parseCsvRows(upload.data, spec)
    if (!outcome.ok) throw refusal(outcome)
    const { rows: all, issues } = outcome.sheet
    for (let i = 0; i < all.length; i += chunkRows) {
      const part = all.slice(i, i + chunkRows)
      const first = part[0].row
      const last = part[part.length - 1].row
      await take({ rows: part, issues: issues.filter((x) => x.row >= first && x.row <= last) })
    }
    return rows
  }
  const outcome = await parseInChild({ kind: upload.kind, data: upload.data, spec, chunkRows }, limits, take)
  if (!outcome.ok) throw refusal(outcome)
  if (outcome.sheet.rows.length) await take(outcome.sheet)
  return rows
}

/**
 * The file's data rows as far as can be told before reading it, for a true percentage: a CSV's lines less the
 * header; an .xlsx's first sheet's stated dimension less the header (null when it states none).
 */
export async function rowsInUpload(upload: GuardedUpload): Promise<number | null> {
  const data = upload.data
  if (upload.kind === 'csv') {
    let lines = 0
    for (let i = data.indexOf(10); i !== -1; i = data.indexOf(10, i + 1)) lines++
    if (data.length && data[data.length - 1] !== 10) lines++
    return Math.max(0, lines - 1)
  }
  const head = await sheetHead(data).catch(() => null)
  const match = head && /<dimension\s+ref="[A-Z]+\d+(?::[A-Z]+(\d+))?"/.exec(head)
  return match?.[1] ? Math.max(0, Number(match[1]) - 1) : null
}

/** The first few kilobytes of the first worksheet's XML, unpacked (the dimension stands before the rows). */
function sheetHead(data: Buffer): Promise<string | null> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(data, { lazyEntries: true }, (openError, zip) => {
      if (openError || !zip) return reject(openError ?? new Error('no zip'))
      let over = false
      const done = (head: string | null) => {
        if (over) return
        over = true
        zip.close()
        resolve(head)
      }
      zip.on('entry', (entry: yauzl.Entry) => {
        if (entry.fileName !== 'xl/worksheets/sheet1.xml') return zip.readEntry()
        zip.openReadStream(entry, (err, stream) => {
          if (err || !stream) return done(null)
          let text = ''
          stream.on('data', (chunk: Buffer) => {
            text += chunk.toString('utf8')
            if (text.length >= 4096) {
              stream.destroy()
              done(text)
            }
          })
          stream.on('end', () => done(text))
          stream.on('error', () => done(null))
        })
      })
      zip.on('end', () => done(null))
      zip.on('error', reject)
      zip.readEntry()
    })
  })
}
