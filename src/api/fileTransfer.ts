// File transfers the fetch client cannot do: uploads with a progress figure and a way to stop them
// (XMLHttpRequest reports upload progress; fetch does not), and saving a downloaded file.
import type { ZodType } from 'zod'
import { apiErrorFrom, checkAnswer } from './client'

/** A two-step spreadsheet upload (checked, then written): each step's route and the schema of its answer. */
export interface SheetSteps<P, C> {
  path: (which: 'preview' | 'commit') => string
  previewAnswer: ZodType<P>
  commitAnswer: ZodType<C>
}

export interface UploadHandle<T> {
  done: Promise<T>
  abort(): void
}

/**
 * Posts a form with a file; onProgress gets 0–1 while sending, then 1 while the server works. The answer is
 * checked against its schema like every fetch answer (src/api/client.ts).
 */
export function uploadWithProgress<T>(path: string, form: FormData, answer: ZodType<T>, onProgress: (fraction: number) => void): UploadHandle<T> {
  const xhr = new XMLHttpRequest()
  const done = new Promise<T>((resolve, reject) => {
    xhr.open('POST', '/api' + path)
    xhr.setRequestHeader('X-Lumenyard-Request', '1')
    xhr.setRequestHeader('Accept', 'application/json')
    xhr.withCredentials = true
    xhr.upload.onprogress = (e) => onProgress(e.lengthComputable ? e.loaded / e.total : 0)
    xhr.upload.onload = () => onProgress(1)
    xhr.onerror = () => reject(apiErrorFrom(0, null, 'network'))
    xhr.onabort = () => reject(apiErrorFrom(0, null, 'aborted'))
    xhr.onload = () => {
      let body: unknown = null
      try {
        body = JSON.parse(xhr.responseText)
      } catch {
        body = null
      }
      if (xhr.status < 200 || xhr.status >= 300) return reject(apiErrorFrom(xhr.status, body))
      try {
        resolve(checkAnswer(answer, body, path))
      } catch (err) {
        reject(err)
      }
    }
    xhr.send(form)
  })
  return { done, abort: () => xhr.abort() }
}

/** Hands a downloaded file to the browser's save. */
export function saveFile(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob)
  const a = document.createElement('a')
  a.href = url
  a.download = filename
  document.body.appendChild(a)
  a.click()
  a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 1000)
}

/**
 * GETs a file the server streams as it writes it, reporting the bytes received so far (a streamed
 * spreadsheet has no length to show a fraction of). Errors arrive as JSON, as from the fetch client.
 */
export async function downloadWithProgress(path: string, onBytes: (bytes: number) => void): Promise<{ blob: Blob; filename: string }> {
  const res = await fetch('/api' + path, { credentials: 'same-origin', headers: { 'X-Lumenyard-Request': '1' } })
  if (!res.ok) throw apiErrorFrom(res.status, await res.json().catch(() => null))
  const filename = /filename="?([^";]+)"?/.exec(res.headers.get('content-disposition') ?? '')?.[1] ?? 'download'
  const type = res.headers.get('content-type') ?? 'application/octet-stream'
  if (!res.body) return { blob: await res.blob(), filename }
  const reader = res.body.getReader()
  const parts: Uint8Array[] = []
  let bytes = 0
  for (;;) {
    const { done, value } = await reader.read()
    if (done) break
    parts.push(value)
    bytes += value.byteLength
    onBytes(bytes)
  }
  return { blob: new Blob(parts as BlobPart[], { type }), filename }
}
