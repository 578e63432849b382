// Goods leaving an order, for return tests: the order's held stock is taken out of its bins through the
// stock service's own path for held stock (pickReserved, the ledger's 'pick' move), and the order line then
// counts it as picked and handed over, as the signed handover does.
import type { DataSource } from 'typeorm'
import { pickReserved } from '../../server/services/stock/stockReservations.js'
import { SALES_ORDER_DOC } from '../../server/services/sales/salesOrderWrite.js'

export async function handOver(ds: DataSource, orderId: number, itemId: number, qty: number): Promise<number> {
  return ds.transaction(async (em) => {
    const [line]: { id: number }[] = await em.query('SELECT id FROM sales_order_lines WHERE sales_order_id = ? AND item_id = ?', [orderId, itemId])
    const holds: { id: number; qty: number }[] = await em.query(
      'SELECT id, qty FROM stock_reservations WHERE doc_type = ? AND doc_id = ? AND doc_line_id = ? ORDER BY id', [SALES_ORDER_DOC, orderId, line.id],
    )
    let rest = qty
    for (const h of holds) {
      if (rest === 0) break
      const q = Math.min(rest, h.qty)
      await pickReserved(em, { userId: null }, { reservationId: h.id, qty: q, doc: { docType: 'test_handover', docId: orderId, docLineId: line.id } })
      rest -= q
    }
    if (rest > 0) throw new Error(`only ${qty - rest} of ${qty} were held for the order`)
    await em.query('UPDATE sales_order_lines SET qty_picked = qty_picked + ?, qty_handed_over = qty_handed_over + ?, qty_reserved = qty_reserved - ? WHERE id = ?', [qty, qty, qty, line.id])
    return Number(line.id)
  })
}
