import type { Response } from 'express'

/** Answers with a file download; the handler then returns undefined (the response is written). */
export function sendDownload(res: Response, file: { name: string; type: string; bytes: Buffer }): undefined {
  res.setHeader('Content-Type', file.type)
  res.setHeader('Content-Disposition', `attachment; filename="${file.name.replace(/[^A-Za-z0-9._-]/g, '_')}"`)
  res.send(file.bytes)
  return undefined
}
