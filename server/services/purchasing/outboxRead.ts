// The outbox as the admin page and the PO page read it: every send attempt, newest first.
import type { DataSource, EntityManager } from 'typeorm'
import type { OutboxSummary } from '../../../shared/schemas/purchasingViews.js'
import { AppError } from '../../errors.js'

interface OutboxRow {
  id: number; created_at: Date; sent_at: Date | null; status: 'sent' | 'failed'; from_address: string; to_address: string
  cc: string | null; subject: string; body_text: string; error: string | null; po_id: number | null; po_number: string | null
  attachment_name: string | null; attachment_bytes: string | number | null; created_by_name: string | null
}

export async function listOutbox(db: EntityManager | DataSource, filter: { poId?: number; limit?: number } = {}): Promise<OutboxSummary[]> {
  const rows: OutboxRow[] = await db.query(
    `SELECT m.id, m.created_at, m.sent_at, m.status, m.from_address, m.to_address, m.cc, m.subject, m.body_text, m.error, m.po_id,
            o.number AS po_number, m.attachment_name, OCTET_LENGTH(m.attachment) AS attachment_bytes, u.display_name AS created_by_name
       FROM outbox_messages m LEFT JOIN purchase_orders o ON o.id = m.po_id LEFT JOIN users u ON u.id = m.created_by
      ${filter.poId ? 'WHERE m.po_id = ?' : ''} ORDER BY m.id DESC LIMIT ?`,
    filter.poId ? [filter.poId, filter.limit ?? 200] : [filter.limit ?? 200],
  )
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
    attachmentName: r.attachment_name,
    attachmentBytes: Number(r.attachment_bytes ?? 0),
    createdBy: r.created_by_name,
  }))
}

export async function outboxAttachment(ds: DataSource, id: number): Promise<{ name: string; type: string; bytes: Buffer }> {
  const [row]: { attachment_name: string | null; attachment_type: string | null; attachment: Buffer | null }[] = await ds.query(
    'SELECT attachment_name, attachment_type, attachment FROM outbox_messages WHERE id = ?',
    [id],
  )
  if (!row || !row.attachment || !row.attachment_name) throw AppError.notFound('That attachment')
  return { name: row.attachment_name, type: row.attachment_type ?? 'application/octet-stream', bytes: row.attachment }
}
