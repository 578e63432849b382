// One typed client over fetch. Every failure becomes an ApiError with the server's code, and its
// message and field messages already worded in the user's language (src/i18n/errorText.ts), so forms
// show field errors beside inputs and the rest in a message.
import type { input as ZodInput, ZodType } from 'zod'
import type { ErrorParams, Problem } from '@shared/errors/errorCodes'
import type { ApiErrorBody } from '@shared/schemas/apiError'
import { errorText, fieldTexts } from '@/i18n/errorText'
import { answered, OUTAGE_STATUSES, outageSeen, pause, READ_RETRY_DELAYS_MS, readRetryDone } from './outage'

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    /** In the user's language. */
    message: string,
    /** Per field, in the user's language. */
    readonly fields: Record<string, string> = {},
    readonly params: ErrorParams = {},
    /** Per field, the code and values (to tell situations apart without reading words). */
    readonly problems: Record<string, Problem> = {},
    /** The server's English message, for the console. */
    readonly serverMessage = '',
  ) {
    super(message)
  }
}

/** The one way an error answer (or a failure to get one) becomes an ApiError. */
export function apiErrorFrom(status: number, body: unknown, fallbackCode = `http_${status}`): ApiError {
  const e = (body as ApiErrorBody | null)?.error
  const code = typeof e?.code === 'string' ? e.code : fallbackCode
  const params = e?.params ?? {}
  const problems = e?.fields ?? {}
  return new ApiError(status, code, errorText({ status, code, params, message: e?.message }), fieldTexts(problems), params, problems, e?.message ?? '')
}

export function isApiError(err: unknown): err is ApiError {
  return err instanceof ApiError
}

type Listener = () => void
const unauthenticatedListeners: Listener[] = []
/** Called on any 401 (session ended elsewhere, timed out): the session store signs out locally. */
export function onUnauthenticated(listener: Listener): void {
  unauthenticatedListeners.push(listener)
}

/** A request body as its shared schema reads it (shared/schemas): the server parses it with the same schema. */
export type BodyOf<S extends ZodType> = ZodInput<S>

export interface RequestOptions<T = unknown> {
  headers?: Record<string, string>
  signal?: AbortSignal
  /** A 401 from this call is expected (sign-in) and must not trigger the global handler. */
  quiet401?: boolean
  /** The answer's schema (shared/schemas): the answer's type, and its check in development and tests. */
  answer?: ZodType<T>
}

/**
 * Answers are checked against their schema in development and in the browser tests' build (vite --mode test),
 * so a server and a screen that disagree fail there; production passes the server's answer on unchecked.
 */
const CHECK_ANSWERS = import.meta.env.DEV || import.meta.env.MODE === 'test'

/**
 * The answer as its schema's type, once it matches (when checking). The server's own value is passed on,
 * not the parsed copy, so a schema's defaults or transforms never make development differ from production.
 */
export function checkAnswer<T>(schema: ZodType<T> | undefined, data: unknown, path: string): T {
  if (schema && CHECK_ANSWERS) {
    const got = schema.safeParse(data)
    if (!got.success) {
      console.error(`The answer of ${path} does not match its schema`, got.error.issues)
      throw apiErrorFrom(200, null, 'answer_shape')
    }
  }
  return data as T
}

/** A read the server could not answer for an outage is tried again by itself; anything else is answered once. */
async function request<T>(method: string, path: string, body?: unknown, opts: RequestOptions<T> = {}): Promise<T> {
  if (method !== 'GET') return requestOnce<T>(method, path, body, opts)
  let retrying = false
  try {
    for (let attempt = 0; ; attempt++) {
      try {
        return await requestOnce<T>(method, path, body, opts)
      } catch (err) {
        if (!(err instanceof ApiError) || !OUTAGE_STATUSES.has(err.status) || attempt >= READ_RETRY_DELAYS_MS.length) throw err
        if (!retrying) outageSeen(true)
        retrying = true
        await pause(READ_RETRY_DELAYS_MS[attempt], opts.signal)
      }
    }
  } finally {
    if (retrying) readRetryDone()
  }
}

async function requestOnce<T>(method: string, path: string, body?: unknown, opts: RequestOptions<T> = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json', 'X-Lumenyard-Request': '1', ...opts.headers }
  let payload: BodyInit | undefined
  if (body instanceof FormData) payload = body
  else if (body !== undefined) {
    headers['Content-Type'] = 'application/json'
    payload = JSON.stringify(body)
  }
  let res: Response
  try {
    res = await fetch('/api' + path, { method, headers, body: payload, credentials: 'same-origin', signal: opts.signal })
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err
    throw apiErrorFrom(0, null, 'network')
  }
  if (OUTAGE_STATUSES.has(res.status)) outageSeen(false)
  else answered()
  if (res.status === 204) return checkAnswer(opts.answer, undefined, path)
  const type = res.headers.get('content-type') ?? ''
  const data = type.includes('application/json') ? await res.json().catch(() => null) : null
  if (!res.ok) {
    if (res.status === 401 && !opts.quiet401) unauthenticatedListeners.forEach((l) => l())
    throw apiErrorFrom(res.status, data)
  }
  return checkAnswer(opts.answer, data, path)
}

/** Downloads a file answer (spreadsheets, exports) as a Blob with its suggested name. */
export async function download(path: string): Promise<{ blob: Blob; filename: string }> {
  const res = await fetch('/api' + path, { credentials: 'same-origin', headers: { 'X-Lumenyard-Request': '1' } })
  if (!res.ok) {
    throw apiErrorFrom(res.status, await res.json().catch(() => null))
  }
  const disposition = res.headers.get('content-disposition') ?? ''
  const filename = /filename="?([^";]+)"?/.exec(disposition)?.[1] ?? 'download'
  return { blob: await res.blob(), filename }
}

/** GETs started before the page asked (see prefetchGet): taken once, by the first identical call. */
const early = new Map<string, { at: number; answer: Promise<unknown> }>()
const EARLY_MS = 15_000

/**
 * Starts a GET the page about to open will make, so it runs in parallel with the page's code instead of
 * after it. Quiet on 401: the guard may start it before it knows the visitor is signed in.
 */
export function prefetchGet(path: string): void {
  const answer = request<unknown>('GET', path, undefined, { quiet401: true })
  const entry = { at: Date.now(), answer }
  early.set(path, entry)
  answer.catch(() => {
    if (early.get(path) === entry) early.delete(path) // the page asks again itself
  })
}

/** Answers started for the previous user must not reach the next one: forgotten on sign-out. */
export function forgetPrefetched(): void {
  early.clear()
}

function get<T>(path: string, opts?: RequestOptions<T>): Promise<T> {
  const hit = early.get(path)
  if (hit && !opts?.signal) {
    early.delete(path)
    if (Date.now() - hit.at < EARLY_MS) return hit.answer.then((data) => checkAnswer(opts?.answer, data, path))
  }
  return request<T>('GET', path, undefined, opts)
}

/**
 * The fetch client the typed area modules (src/api/*.ts) are written with. Views and components call those
 * modules, never a path (eslint.config.ts refuses `api.get('/…')` there).
 */
export const api = {
  get,
  post: <T>(path: string, body?: unknown, opts?: RequestOptions<T>) => request<T>('POST', path, body ?? {}, opts),
  put: <T>(path: string, body?: unknown, opts?: RequestOptions<T>) => request<T>('PUT', path, body ?? {}, opts),
  patch: <T>(path: string, body?: unknown, opts?: RequestOptions<T>) => request<T>('PATCH', path, body ?? {}, opts),
  delete: <T>(path: string, opts?: RequestOptions<T>) => request<T>('DELETE', path, undefined, opts),
}
