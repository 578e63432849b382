// The outbox as the admin page and the PO page read it: every send attempt, newest first, with its
// attachments, and whether a failed one was already sent again.
import type { DataSource, EntityManager } from 'typeorm'
import type { OutboxSummary } from '../../../shared/schemas/purchasingViews.js'
import { AppError } from '../../errors.js'

interface OutboxRow {
  id: number; created_at: Date; sent_at: Date | null; status: 'sent' | 'failed'; from_address: string; to_address: string
  cc: string | null; subject: string; body_text: string; error: string | null; po_id: number | null; po_number: string | null
  created_by_name: string | null; retry_of: number | null; retried_by: number | null
}

export async function listOutbox(db: EntityManager | DataSource, filter: { poId?: number; limit?: number } = {}): Promise<OutboxSummary[]> {
  const rows: OutboxRow[] = await db.query(
    `SELECT m.id, m.created_at, m.sent_at, m.status, m.from_address, m.to_address, m.cc, m.subject, m.body_text, m.error, m.po_id,
            o.number AS po_number, u.display_name AS created_by_name, m.retry_of, r.id AS retried_by
       FROM outbox_messages m LEFT JOIN purchase_orders o ON o.id = m.po_id LEFT JOIN users u ON u.id = m.created_by
       LEFT JOIN outbox_messages r ON r.retry_of = m.id
      ${filter.poId ? 'WHERE m.po_id = ?' : ''} ORDER BY m.id DESC LIMIT ?`,
    filter.poId ? [filter.poId, filter.limit ?? 200] : [filter.limit ?? 200],
  )
  const files: { id: number; message_id: number; name: string; size: string | number }[] = rows.length
    ? await db.query(
      `SELECT id, message_id, name, OCTET_LENGTH(bytes) AS size FROM outbox_attachments WHERE message_id IN (${rows.map(() => '?').join(',')}) ORDER BY id`,
      rows.map((r) => r.id),
    )
    : []
  return rows.map((r) => ({
    id: r.id,
    createdAt: new Date(r.created_at).toISOString(),
    sentAt: r.sent_at ? new Date(r.sent_at).toISOString() : null,
    status: r.status,
    fromAddress: r.from_address,
    toAddress: r.to_address,
    cc: r.cc,
    subject: r.subject,
    bodyText: r.body_text,
    error: r.error,
    poId: r.po_id,
    poNumber: r.po_number,
    attachments: files.filter((f) => f.message_id === r.id).map((f) => ({ id: f.id, name: f.name, bytes: Number(f.size) })),
    createdBy: r.created_by_name,
    retryOf: r.retry_of,
    sentAgainAs: r.retried_by,
  }))
}

export async function outboxAttachment(ds: DataSource, messageId: number, attachmentId: number): Promise<{ name: string; type: string; bytes: Buffer }> {
  const [row]: { name: string; content_type: string; bytes: Buffer }[] = await ds.query(
    'SELECT name, content_type, bytes FROM outbox_attachments WHERE id = ? AND message_id = ?',
    [attachmentId, messageId],
  )
  if (!row) throw AppError.notFound('attachment_not_found', 'That attachment was not found.')
  return { name: row.name, type: row.content_type, bytes: row.bytes }
}
