// The request edge of an upload: multer in memory with explicit limits, one field named "file". What the file
// must be (kind, size of its parts, image type) is checked by services/imports/uploadGuard.ts.
import type { Request, Response } from 'express'
import multer from 'multer'
import { guardImage, guardUpload, type GuardedImage, type GuardedUpload, type UploadRules } from '../services/imports/uploadGuard.js'

/** Runs multer for one field named "file" with the configured size cap. */
function receive(req: Request, res: Response, maxBytes: number): Promise<void> {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { files: 1, fileSize: maxBytes, fields: 5, fieldSize: 1024, parts: 6, headerPairs: 100 },
  }).single('file')
  return new Promise((resolve, reject) => upload(req, res, (err: unknown) => (err ? reject(err) : resolve())))
}

/** Receives the upload and checks it is what its extension says. */
export async function receiveUpload(req: Request, res: Response, opts: UploadRules): Promise<GuardedUpload> {
  await receive(req, res, opts.maxBytes)
  return guardUpload(req.file, opts)
}

/** Receives one image (PNG or JPEG) up to maxBytes. */
export async function receiveImage(req: Request, res: Response, maxBytes: number): Promise<GuardedImage> {
  await receive(req, res, maxBytes)
  return guardImage(req.file)
}
