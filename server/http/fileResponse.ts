import type { Readable } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import type { Response } from 'express'
import { XLSX_TYPE } from '../services/exports/xlsxWriter.js'

/** Answers with a file download; the handler then returns undefined (the response is written). */
export function sendDownload(res: Response, file: { name: string; type: string; bytes: Buffer }): undefined {
  res.setHeader('Content-Type', file.type)
  res.setHeader('Content-Disposition', `attachment; filename="${file.name.replace(/[^A-Za-z0-9._-]/g, '_')}"`)
  res.send(file.bytes)
  return undefined
}

/** Sends a workbook as a download; the file name is ours, never the user's text. */
export function sendXlsx(res: Response, filename: string, body: Buffer): void {
  sendDownload(res, { name: filename, type: XLSX_TYPE, bytes: body })
}

/** Streams a file as a download with its length, so the browser can show how much is left. */
export async function sendFileDownload(res: Response, file: { stream: Readable; name: string; type: string; bytes: number }): Promise<undefined> {
  res.setHeader('Content-Type', file.type)
  res.setHeader('Content-Length', String(file.bytes))
  res.setHeader('Content-Disposition', `attachment; filename="${file.name.replace(/[^A-Za-z0-9._-]/g, '_')}"`)
  res.setHeader('Cache-Control', 'no-store')
  await pipeline(file.stream, res)
  return undefined
}
