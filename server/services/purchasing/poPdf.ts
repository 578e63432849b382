// A purchase order as a printable PDF (pdfkit, with the Open Sans shipped in @fontsource: nothing fetched):
// who orders, bill-to and ship-to, the vendor, the dates, every line, and each made-to-order line's whole
// specification under it. Prices only for callers who may see costs.
import { formatMoney } from '../../../shared/money.js'
import { INK, MARGIN, openPdfSheet, pdfTable, SOFT, type PdfColumn } from '../exports/pdfSheet.js'
import { buyerLine, type PoPaper } from './poDocument.js'

export { PDF_TYPE } from '../exports/pdfSheet.js'

/**
 * Text for a box `width` wide whose words fit it: a word wider than the box (an e-mail address, a web
 * address) is broken only after an @ or a dot, never inside a name, nor after a dash (a line ending in a
 * dash reads as a hyphenated word, and the dash gets dropped). pdfkit would otherwise cut it at whatever
 * letter reaches the edge.
 */
export function breakLongWords(doc: PDFKit.PDFDocument, text: string, width: number): string {
  return text.split('\n').map((line) => line.split(' ').map((word) => {
    if (doc.widthOfString(word) <= width) return word
    const pieces = word.match(/[^@.]+[@.]*|[@.]+/g) ?? [word]
    const lines: string[] = []
    let current = ''
    for (const piece of pieces) {
      if (current && doc.widthOfString(current + piece) > width) {
        lines.push(current)
        current = piece
      } else current += piece
    }
    return [...lines, current].join('\n')
  }).join(' ')).join('\n')
}

export function poPdf(paper: PoPaper): Promise<Buffer> {
  const { po, company } = paper
  const sheet = openPdfSheet(`Purchase order ${po.number}`, company.legalName || 'Lumenyard', paper.logo)
  const { doc, width } = sheet
  const money = (amount: string | undefined) => (amount === undefined ? '' : formatMoney(amount, { symbol: `${po.currency} ` }))

  // Title and who orders.
  doc.font('bold').fontSize(18).fillColor(INK).text(`Purchase order ${po.number}`)
  doc.font('bold').fontSize(11).text(company.legalName || '—')
  doc.font('body').fontSize(9).fillColor(SOFT).text([company.phone, company.email, company.taxNumber ? `Tax number ${company.taxNumber}` : null].filter(Boolean).join(' · '))
  doc.moveDown(0.8)

  // Three blocks side by side: vendor, bill to, ship to.
  const top = doc.y
  const third = width / 3
  const blockAt = (i: number, label: string, text: string) => {
    doc.font('bold').fontSize(9).fillColor(SOFT).text(label, MARGIN + i * third, top, { width: third - 12 })
    doc.font('body').fontSize(10).fillColor(INK)
    doc.text(breakLongWords(doc, text || '—', third - 12), { width: third - 12 })
    return doc.y
  }
  const v = po.vendor
  const bottom = Math.max(
    blockAt(0, 'Vendor', [v.name, v.contactName, v.email, v.phone, v.address].filter(Boolean).join('\n')),
    blockAt(1, 'Bill to', paper.billTo),
    blockAt(2, 'Ship to', paper.shipTo),
  )
  doc.x = MARGIN
  doc.y = bottom + 10

  // The order's facts in two columns.
  const facts: [string, string | null][] = [
    ['Order date', po.createdAt.slice(0, 10)],
    ['Wanted by', po.expectedDate],
    ['Payment terms', v.terms],
    ['Currency', po.currency],
    ['Buyer', buyerLine(paper)],
    ['Reply to', paper.replyTo],
    ['Job', po.job ? (po.job.dueDate ? `${po.job.name} (due ${po.job.dueDate})` : po.job.name) : null],
  ]
  // Two facts a row, each value beside its label; a value too wide for half the page (a long e-mail
  // address, a job's name) takes a row of its own rather than being cut.
  const half = width / 2
  doc.font('body').fontSize(10)
  const shown = facts.filter((f): f is [string, string] => !!f[1])
  const rows: [string, string][][] = []
  for (const fact of shown) {
    const wide = doc.widthOfString(fact[1]) > half - 90
    const last = rows[rows.length - 1]
    if (!wide && last && last.length === 1 && doc.widthOfString(last[0][1]) <= half - 90) last.push(fact)
    else rows.push([fact])
  }
  for (const pair of rows) {
    const y = doc.y
    let tallest = 0
    pair.forEach(([label, value], j) => {
      const x = MARGIN + j * half
      const valueWidth = pair.length === 1 ? width - 90 : half - 90
      doc.font('bold').fontSize(9).fillColor(SOFT).text(label, x, y, { width: 80 })
      doc.font('body').fontSize(10).fillColor(INK)
      const text = breakLongWords(doc, value, valueWidth)
      tallest = Math.max(tallest, doc.heightOfString(text, { width: valueWidth }))
      doc.text(text, x + 84, y, { width: valueWidth })
    })
    doc.x = MARGIN
    doc.y = y + Math.max(tallest, 12) + 3
  }
  doc.y += 10

  // The lines.
  const prices = paper.costs && po.orderTotal !== undefined
  // Amounts without the currency code: the order states its currency once, above.
  const columns: PdfColumn[] = [
    { header: '#', width: 22, align: 'left' },
    { header: 'Our SKU / vendor SKU', width: 104, align: 'left' },
    { header: 'Description', width: prices ? 150 : width - 236, align: 'left' },
    { header: 'Packs', width: 50, align: 'right' },
    { header: 'Quantity', width: 60, align: 'right' },
    ...(prices ? ([{ header: 'Unit cost', width: 60, align: 'right' }, { header: 'Line total', width: width - 446, align: 'right' }] as PdfColumn[]) : []),
  ]
  const { row, rule, header, keepRoom } = pdfTable(sheet, columns)
  header()
  for (const l of paper.lines) {
    keepRoom(80)
    row([
      String(l.lineNo), [l.sku, l.vendorSku].filter(Boolean).join('\n'), l.description,
      `${l.packsOrdered} × ${l.packQty}`, `${l.qtyOrdered} ${l.stockUnit}`,
      ...(prices ? [l.unitCost ? formatMoney(l.unitCost, { symbol: '', decimals: 4 }) : '', l.lineTotal ? formatMoney(l.lineTotal, { symbol: '' }) : ''] : []),
    ], 'body')
    if (l.specification) {
      // The whole specification, across the table, never cut: the vendor builds from it.
      doc.font('bold').fontSize(9).fillColor(INK).text('Specification: ', MARGIN + 22, doc.y, { continued: true, width: width - 22 })
      doc.font('body').text(l.specification)
      doc.x = MARGIN
      doc.y += 4
    }
    rule()
    doc.y += 4
  }
  if (prices) {
    doc.font('bold').fontSize(11).fillColor(INK).text(`Total ${money(po.orderTotal)}`, MARGIN, doc.y + 4, { width, align: 'right' })
  }
  if (po.notes) {
    doc.moveDown(0.8)
    doc.font('bold').fontSize(9).fillColor(SOFT).text('Notes', MARGIN, doc.y, { width })
    doc.font('body').fontSize(10).fillColor(INK).text(po.notes, { width })
  }
  doc.moveDown(1)
  doc.font('body').fontSize(9).fillColor(SOFT)
  // The address on a line of its own, so the sentence's wrapping never splits it.
  const closing = `Please confirm this order and its ship date, quoting ${po.number} on every delivery note and invoice${paper.replyTo ? `, by reply to:\n${paper.replyTo}` : '.'}`
  doc.text(breakLongWords(doc, closing, width), MARGIN, doc.y, { width })

  return sheet.finish(po.number)
}
