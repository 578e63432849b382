// File transfers the fetch client cannot do: uploads with a progress figure and a way to stop them
// (XMLHttpRequest reports upload progress; fetch does not), and saving a downloaded file.
import { apiErrorFrom } from './client'

export interface UploadHandle<T> {
  done: Promise<T>
  abort(): void
}

/** Posts a form with a file; onProgress gets 0–1 while sending, then 1 while the server works. */
export function uploadWithProgress<T>(path: string, form: FormData, onProgress: (fraction: number) => void): UploadHandle<T> {
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
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as T)
      reject(apiErrorFrom(xhr.status, body))
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
