// File downloads in API tests: the raw bytes of an answer, and every text cell of a workbook.
import ExcelJS from 'exceljs'
import type supertest from 'supertest'

/** GET a download and keep its body as bytes (supertest would otherwise try to parse it). */
export function download(agent: supertest.Agent, path: string) {
  return agent.get(path).buffer(true).parse((r, done) => {
    const chunks: Buffer[] = []
    r.on('data', (c: Buffer) => chunks.push(c))
    r.on('end', () => done(null, Buffer.concat(chunks)))
  })
}

export const arrayBufferOf = (b: Buffer) => b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength) as ArrayBuffer

export async function loadWorkbook(bytes: Buffer): Promise<ExcelJS.Workbook> {
  const book = new ExcelJS.Workbook()
  await book.xlsx.load(arrayBufferOf(bytes))
  return book
}

/** Every text cell of every sheet, as written. */
export function workbookTexts(book: ExcelJS.Workbook): string[] {
  const texts: string[] = []
  book.eachSheet((sheet) => sheet.eachRow((row) => row.eachCell((cell) => {
    if (typeof cell.value === 'string') texts.push(cell.value)
  })))
  return texts
}

/** Every file of a zip archive by name, read with yauzl (the same reader the upload guard uses). */
export async function unzipEntries(bytes: Buffer): Promise<Map<string, Buffer>> {
  const { default: yauzl } = await import('yauzl')
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(bytes, { lazyEntries: true, validateEntrySizes: true }, (openError, zip) => {
      if (openError || !zip) return reject(openError ?? new Error('not a zip'))
      const files = new Map<string, Buffer>()
      zip.on('error', reject)
      zip.on('end', () => resolve(files))
      zip.on('entry', (entry: import('yauzl').Entry) => {
        zip.openReadStream(entry, (streamError, stream) => {
          if (streamError || !stream) return reject(streamError ?? new Error('unreadable entry'))
          const chunks: Buffer[] = []
          stream.on('data', (c: Buffer) => chunks.push(c))
          stream.on('end', () => {
            files.set(entry.fileName, Buffer.concat(chunks))
            zip.readEntry()
          })
        })
      })
      zip.readEntry()
    })
  })
}
