// Files kept in MariaDB so that any app process serves them (an import's upload between check and commit, an
// everything-out zip until downloaded), not one server's disk. A file is written and read in parts of 1 MB, each
// one row of stored_file_parts (far below max_allowed_packet), so a large file is never held whole: the writer
// is a stream that sends a part whenever 1 MB has gathered (and waits for it, so a slow database slows the
// producer), the reader a stream that fetches one part at a time. Past its `expires_at` a file is gone.
import { randomUUID } from 'node:crypto'
import { Readable, Writable } from 'node:stream'
import type { DataSource } from 'typeorm'

export const PART_BYTES = 1024 * 1024

export type StoredFilePurpose = 'import_upload' | 'business_export'

export interface StoredFileWriter {
  id: string
  /** Write the file into this; its end sends the last part and records the length. */
  stream: Writable
}

/** A new stored file of `name`, kept for `keepMs` from now, written through the returned stream. */
export async function storedFileWriter(ds: DataSource, purpose: StoredFilePurpose, name: string, keepMs: number): Promise<StoredFileWriter> {
  const id = randomUUID()
  await ds.query('INSERT INTO stored_files (id, purpose, name, expires_at) VALUES (?, ?, ?, CURRENT_TIMESTAMP(3) + INTERVAL ? MICROSECOND)', [id, purpose, name.slice(0, 255), keepMs * 1000])
  let pending: Buffer[] = []
  let pendingBytes = 0
  let seq = 0
  let bytes = 0
  const sendPart = async (data: Buffer) => {
    await ds.query('INSERT INTO stored_file_parts (file_id, seq, data) VALUES (?, ?, ?)', [id, seq++, data])
    bytes += data.length
  }
  const flushWhole = async () => {
    while (pendingBytes >= PART_BYTES) {
      const all = Buffer.concat(pending)
      await sendPart(all.subarray(0, PART_BYTES))
      const rest = all.subarray(PART_BYTES)
      pending = rest.length ? [rest] : []
      pendingBytes = rest.length
    }
  }
  const stream = new Writable({
    write(chunk: Buffer, _enc, done) {
      pending.push(chunk)
      pendingBytes += chunk.length
      flushWhole().then(() => done(), done)
    },
    final(done) {
      const last = pendingBytes ? sendPart(Buffer.concat(pending)) : Promise.resolve()
      last.then(() => ds.query('UPDATE stored_files SET bytes = ? WHERE id = ?', [bytes, id])).then(() => done(), done)
    },
  })
  return { id, stream }
}

/** Keeps `data` as a stored file and answers its id. */
export async function storeFile(ds: DataSource, purpose: StoredFilePurpose, name: string, data: Buffer, keepMs: number): Promise<string> {
  const writer = await storedFileWriter(ds, purpose, name, keepMs)
  await new Promise<void>((resolve, reject) => {
    writer.stream.on('finish', resolve).on('error', reject)
    writer.stream.end(data)
  })
  return writer.id
}

/** The length of a whole, unexpired stored file, or null when it is gone or not finished. */
export async function storedFileBytes(ds: DataSource, id: string): Promise<number | null> {
  const [row]: { bytes: string | number | null }[] = await ds.query('SELECT bytes FROM stored_files WHERE id = ? AND expires_at > CURRENT_TIMESTAMP(3)', [id])
  return row?.bytes == null ? null : Number(row.bytes)
}

/** The file's parts one after another, each fetched when the reader wants it. */
export function readStoredFile(ds: DataSource, id: string): Readable {
  async function* parts() {
    for (let seq = 0; ; seq++) {
      const [part]: { data: Buffer }[] = await ds.query('SELECT data FROM stored_file_parts WHERE file_id = ? AND seq = ?', [id, seq])
      if (!part) return
      yield part.data
    }
  }
  return Readable.from(parts(), { objectMode: false })
}

/** A whole stored file in memory (an upload, which the parser takes whole and is capped in size), or null when gone. */
export async function loadStoredFile(ds: DataSource, id: string): Promise<Buffer | null> {
  if ((await storedFileBytes(ds, id)) === null) return null
  const parts: Buffer[] = []
  for await (const part of readStoredFile(ds, id)) parts.push(part as Buffer)
  return Buffer.concat(parts)
}

/** Ends a file's keeping now (it is no longer offered). */
export async function expireStoredFile(ds: DataSource, id: string): Promise<void> {
  await ds.query('UPDATE stored_files SET expires_at = LEAST(expires_at, CURRENT_TIMESTAMP(3)) WHERE id = ?', [id])
}

/** Deletes every file past its time, its parts with it (ON DELETE CASCADE). */
export async function dropExpiredFiles(ds: DataSource): Promise<void> {
  await ds.query('DELETE FROM stored_files WHERE expires_at < CURRENT_TIMESTAMP(3)')
}
