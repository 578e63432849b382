// Takes one spreadsheet upload safely: multer in memory with explicit limits, then the content is
// checked before anything parses it. An .xlsx must be a zip holding [Content_Types].xml whose
// entries stay under an entry count, a total unpacked size and a compression ratio (a zip bomb is
// refused while being measured, never unpacked whole); a .csv must be UTF-8 text with no NUL bytes.
import path from 'node:path'
import yauzl from 'yauzl'
import { AppError, problem } from '../../errors.js'

export type UploadKind = 'xlsx' | 'csv'

export interface GuardedUpload {
  kind: UploadKind
  filename: string
  data: Buffer
}

export interface ArchiveLimits {
  maxEntries: number
  /** Total unpacked bytes over all entries. */
  maxUnpackedBytes: number
  /** Largest unpacked ÷ packed size of one entry, checked for entries above ratioFloorBytes. */
  maxRatio: number
  ratioFloorBytes: number
}

// A real workbook has a few dozen entries and packs its XML 5–30 times; these leave room for that.
export const DEFAULT_ARCHIVE_LIMITS: ArchiveLimits = {
  maxEntries: 500,
  maxUnpackedBytes: 60 * 1024 * 1024,
  maxRatio: 200,
  ratioFloorBytes: 1024 * 1024,
}

type Refusal = 'file_not_xlsx' | 'csv_binary' | 'csv_not_utf8' | 'xlsx_damaged'
const refuse = (code: Refusal, message: string) => new AppError(415, code, message)
type Excess = 'archive_too_many_parts' | 'archive_too_big' | 'archive_packed_too_tight'
const tooBig = (code: Excess, message: string, params: Record<string, number>) => new AppError(422, code, message, { params })

/** One received file, as the request edge (server/http/upload.ts) hands it over. */
export interface ReceivedFile {
  originalname: string
  buffer: Buffer
}

export function kindOf(filename: string, allowed: readonly UploadKind[]): UploadKind {
  const ext = path.extname(filename).toLowerCase().slice(1)
  if (!(allowed as readonly string[]).includes(ext)) {
    const name = path.basename(filename).slice(0, 60)
    throw AppError.of(415, 'file_type_not_allowed', `Upload ${allowed.map((k) => `.${k}`).join(' or ')} files only; “${name}” is not one.`, { params: { name, allowed: allowed.map((k) => `.${k}`) } })
  }
  return ext as UploadKind
}

export interface UploadRules {
  maxBytes: number
  allowed?: readonly UploadKind[]
  limits?: ArchiveLimits
}

/** Checks a received upload is what its extension says. */
export async function guardUpload(file: ReceivedFile | undefined, opts: UploadRules): Promise<GuardedUpload> {
  if (!file) throw AppError.badRequest('file_missing', 'Choose a file to upload.', { fields: { file: problem('file_missing') } })
  const kind = kindOf(file.originalname, opts.allowed ?? ['xlsx', 'csv'])
  await checkContent(kind, file.buffer, opts.limits ?? DEFAULT_ARCHIVE_LIMITS)
  return { kind, filename: path.basename(file.originalname), data: file.buffer }
}

export async function checkContent(kind: UploadKind, data: Buffer, limits: ArchiveLimits = DEFAULT_ARCHIVE_LIMITS): Promise<void> {
  if (data.length === 0) throw AppError.badRequest('file_empty', 'The file is empty.', { fields: { file: problem('file_empty') } })
  if (kind === 'csv') return checkCsvText(data)
  if (data.readUInt32LE(0) !== 0x04034b50) throw refuse('file_not_xlsx', 'This file is not an .xlsx workbook (it is not a zip archive). Save it from the spreadsheet as .xlsx.')
  await inspectZip(data, limits)
}

function checkCsvText(data: Buffer): void {
  if (data.includes(0)) throw refuse('csv_binary', 'This .csv holds binary data, not text (is it another kind of file renamed?).')
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(data)
  } catch {
    throw refuse('csv_not_utf8', 'This .csv is not UTF-8 text. Save it as “CSV UTF-8” and upload it again.')
  }
}

/** Walks the archive entry by entry, measuring what each really unpacks to, and stops at the first excess. */
function inspectZip(data: Buffer, limits: ArchiveLimits): Promise<void> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(data, { lazyEntries: true, validateEntrySizes: true }, (openError, zip) => {
      if (openError || !zip) return reject(refuse('file_not_xlsx', 'This file is not an .xlsx workbook (the zip archive cannot be read).'))
      let settled = false
      let entries = 0
      let unpacked = 0
      let contentTypes = false
      const fail = (err: AppError) => {
        if (settled) return
        settled = true
        zip.close()
        reject(err)
      }
      zip.on('error', () => fail(refuse('xlsx_damaged', 'This workbook is damaged: its zip archive cannot be read.')))
      zip.on('end', () => {
        if (settled) return
        settled = true
        if (contentTypes) resolve()
        else reject(refuse('file_not_xlsx', 'This file is a zip archive but not an .xlsx workbook ([Content_Types].xml is missing).'))
      })
      zip.on('entry', (entry: yauzl.Entry) => {
        const excess = entryProblem(entry, ++entries, unpacked, limits)
        if (excess) return fail(excess)
        if (entry.fileName === '[Content_Types].xml') contentTypes = true
        if (entry.fileName.endsWith('/')) return zip.readEntry()
        measureEntry(zip, entry, limits, limits.maxUnpackedBytes - unpacked).then((size) => {
          unpacked += size
          zip.readEntry()
        }, fail)
      })
      zip.readEntry()
    })
  })
}

const tooBigToUnpack = (limits: ArchiveLimits) => {
  const mb = Math.round(limits.maxUnpackedBytes / 1048576)
  return tooBig('archive_too_big', `The workbook unpacks to more than ${mb} MB; it was refused (split it into smaller files).`, { mb })
}

function entryProblem(entry: yauzl.Entry, count: number, unpackedSoFar: number, limits: ArchiveLimits): AppError | null {
  if (count > limits.maxEntries) return tooBig('archive_too_many_parts', `The workbook holds more than ${limits.maxEntries} parts; it was refused.`, { max: limits.maxEntries })
  if (unpackedSoFar + entry.uncompressedSize > limits.maxUnpackedBytes) return tooBigToUnpack(limits)
  const ratio = entry.uncompressedSize / Math.max(1, entry.compressedSize)
  if (entry.uncompressedSize > limits.ratioFloorBytes && ratio > limits.maxRatio) {
    return tooBig('archive_packed_too_tight', `A part of the workbook is packed ${Math.round(ratio)} to 1, far more than a real spreadsheet; it was refused.`, { ratio: Math.round(ratio) })
  }
  return null
}

/** Inflates one entry into nothing, counting bytes; yauzl also refuses an entry larger than it declared. */
function measureEntry(zip: yauzl.ZipFile, entry: yauzl.Entry, limits: ArchiveLimits, budget: number): Promise<number> {
  return new Promise((resolve, reject) => {
    zip.openReadStream(entry, (err, stream) => {
      if (err || !stream) return reject(refuse('xlsx_damaged', 'This workbook is damaged or encrypted: a part cannot be read.'))
      let size = 0
      stream.on('data', (chunk: Buffer) => {
        size += chunk.length
        if (size > budget) {
          stream.destroy()
          reject(tooBigToUnpack(limits))
        }
      })
      stream.on('error', () => reject(refuse('xlsx_damaged', 'This workbook is damaged: a part does not unpack to its stated size.')))
      stream.on('end', () => resolve(size))
    })
  })
}

export interface GuardedImage {
  type: 'image/png' | 'image/jpeg'
  data: Buffer
}

/** Checks a received image is a PNG or JPEG, told by its first bytes, never by its name. */
export function guardImage(file: ReceivedFile | undefined): GuardedImage {
  if (!file || !file.buffer.length) throw AppError.badRequest('file_missing', 'Choose a file to upload.', { fields: { file: problem('file_missing') } })
  const b = file.buffer
  if (b.length > 8 && b.readUInt32BE(0) === 0x89504e47) return { type: 'image/png', data: b }
  if (b.length > 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return { type: 'image/jpeg', data: b }
  throw AppError.of(415, 'image_type_not_allowed', 'Upload the logo as a PNG or JPEG image.')
}
