// Parses a guarded upload in a child process (parseWorker.ts) with a heap cap and a timeout: the
// column spec goes in, typed rows and per-row issues come out. Reusable by any import.
import { fork } from 'node:child_process'
import { existsSync } from 'node:fs'
import { createRequire } from 'node:module'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { AppError } from '../../errors.js'
import type { ImportSpec, ParsedSheet, ParseOutcome, RefusalCode } from './importTypes.js'
import type { GuardedUpload } from './uploadGuard.js'
import type { WorkerRequest } from './parseWorker.js'
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

/** Runs the worker once; resolves with its outcome, or a refusal when it ran out of time or memory. */
export function parseInChild(request: WorkerRequest, limits: ParseLimits = DEFAULT_PARSE_LIMITS): Promise<ParseOutcome> {
  return new Promise((resolve) => {
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
    const finish = (outcome: ParseOutcome) => {
      if (done) return
      done = true
      clearTimeout(timer)
      if (child.exitCode === null) child.kill('SIGKILL')
      resolve(outcome)
    }
    const timer = setTimeout(() => finish({ ok: false, code: 'sheet_timeout', message: 'Reading the file took too long; it was stopped. Split it into smaller files.' }), limits.timeoutMs)
    child.stderr?.on('data', (chunk: Buffer) => { stderr = (stderr + chunk.toString()).slice(-4000) })
    child.on('message', (outcome: ParseOutcome) => finish(outcome))
    child.on('error', () => finish({ ok: false, code: 'sheet_unreadable', message: 'The file could not be read.' }))
    child.on('exit', () => {
      const memory = /heap out of memory|Allocation failed/i.test(stderr)
      finish(memory
        ? { ok: false, code: 'sheet_too_big', message: 'The file needs more memory to read than an upload may use; split it into smaller files.' }
        : { ok: false, code: 'sheet_unreadable', message: 'The file could not be read; it may be damaged.' })
    })
    child.send({ ...request, data: new Uint8Array(request.data) })
  })
}

/** CSV files up to this size are parsed in the server's process. */
export const IN_PROCESS_CSV_BYTES = 64 * 1024

const STATUS: Record<RefusalCode, number> = {
  sheet_empty: 422, sheet_columns: 422, sheet_too_many_rows: 413, sheet_too_many_columns: 422, csv_open_quote: 422, sheet_unreadable: 422, sheet_timeout: 422, sheet_too_big: 413,
}

/** The upload's rows against the spec; a file that cannot be read as a whole becomes an AppError. */
export async function parseSpreadsheet(upload: GuardedUpload, spec: ImportSpec, limits?: ParseLimits): Promise<ParsedSheet> {
  // A small CSV is plain text read in one linear pass: nothing in it can blow up, so it is read here
  // rather than paying a child process's start (seconds on a loaded machine) for every short sheet.
  const outcome = upload.kind === 'csv' && upload.data.length <= IN_PROCESS_CSV_BYTES
    ? parseCsvRows(upload.data, spec)
    : await parseInChild({ kind: upload.kind, data: upload.data, spec }, limits)
  if (!outcome.ok) throw new AppError(STATUS[outcome.code], outcome.code, outcome.message, { params: outcome.params })
  return outcome.sheet
}
