// A quote as a printable PDF, through the same PDF library and the same shipped Open Sans as the purchase
// order: who quotes, for whom and which job, every line with quantity, unit price and extension, the tax
// with its rate (or the exemption), the amount due, validity and terms, and the handling cautions.
import { formatMoney } from '../../../shared/money.js'
import type { CompanyProfile } from '../../../shared/schemas/purchasing.js'
import type { QuoteDetail } from '../../../shared/schemas/quotes.js'
import { INK, MARGIN, openPdfSheet, pdfFacts, pdfTable, SOFT, type PdfColumn, type PdfLogo } from '../exports/pdfSheet.js'

export { PDF_TYPE } from '../exports/pdfSheet.js'

/** The cautions every quote carries (heavy sections, cutting, wet areas), deferring to codes and licensed practice. */
export const QUOTE_CAUTIONS =
  'Glass block and pre-made sections are heavy: lift with two people or equipment. Cutting and drilling masonry needs eye, hand and dust protection. ' +
  'Panel sizes, anchoring and shower waterproofing must follow local building codes and licensed professional practice.'

export function quotePdf(quote: QuoteDetail, company: CompanyProfile, logo?: PdfLogo | null): Promise<Buffer> {
  const title = `Quote ${quote.number}${quote.revision > 1 ? ` revision ${quote.revision}` : ''}`
  const sheet = openPdfSheet(title, company.legalName || 'Lumenyard', logo)
  const { doc, width } = sheet
  const money = (a: string) => formatMoney(a)

  doc.font('bold').fontSize(18).fillColor(INK).text(title)
  doc.font('bold').fontSize(11).text(company.legalName || '—')
  doc.font('body').fontSize(9).fillColor(SOFT).text([company.billToAddress?.replace(/\n/g, ', '), company.phone, company.email].filter(Boolean).join(' · '))
  doc.moveDown(0.8)
  pdfFacts(sheet, [
    ['For', [quote.customerName, quote.contactName].filter(Boolean).join(', ')],
    ['Job', quote.jobName],
    ['Quoted on', quote.quotedOn],
    ['Valid until', quote.validUntil],
    ['From', quote.warehouseCode],
    ['Price level', quote.priceLevelCode],
  ])

  const columns: PdfColumn[] = [
    { header: '#', width: 22, align: 'left' },
    { header: 'SKU', width: 96, align: 'left' },
    { header: 'Description', width: width - 22 - 96 - 70 - 70 - 80, align: 'left' },
    { header: 'Quantity', width: 70, align: 'right' },
    { header: 'Unit price', width: 70, align: 'right' },
    { header: 'Extension', width: 80, align: 'right' },
  ]
  const { row, rule, header, keepRoom } = pdfTable(sheet, columns)
  header()
  for (const l of quote.lines) {
    keepRoom(120)
    const qty = l.packs !== null ? `${l.packs} × ${l.packSize} = ${l.qty} ${l.stockUnit}` : `${l.qty} ${l.stockUnit}`
    const price = l.packPrice !== null ? `${money(l.packPrice)} / case` : money(l.unitPrice)
    row([String(l.lineNo), l.sku, l.description + (l.madeToOrder ? ' (made to order)' : ''), qty, price, money(l.extension)], 'body')
    rule()
    doc.y += 3
  }
  const total = (label: string, amount: string, bold = false) =>
    doc.font(bold ? 'bold' : 'body').fontSize(bold ? 11 : 10).fillColor(INK).text(`${label}  ${money(amount)}`, MARGIN, doc.y + 2, { width, align: 'right' })
  total('Subtotal', quote.subtotal)
  const tax = quote.tax
  const taxLabel = tax.exemptCertificate
    ? `Sales tax (exempt, certificate ${tax.exemptCertificate} valid until ${tax.exemptUntil})`
    : tax.noRate ? 'Sales tax (no rate set for this location)' : `Sales tax ${Number(tax.ratePercent)} %`
  total(taxLabel, quote.taxAmount)
  total('Amount due', quote.amountDue, true)
  doc.font('body').fontSize(9).fillColor(SOFT).text(`Total weight about ${quote.weightKg} kg.`, MARGIN, doc.y + 4, { width, align: 'right' })
  if (quote.terms) {
    doc.moveDown(0.8)
    doc.font('bold').fontSize(9).fillColor(SOFT).text('Terms', MARGIN, doc.y, { width })
    doc.font('body').fontSize(10).fillColor(INK).text(quote.terms, { width })
  }
  doc.moveDown(0.8)
  doc.font('bold').fontSize(9).fillColor(INK).text('Safety', MARGIN, doc.y, { width })
  doc.font('body').fontSize(9).fillColor(SOFT).text(QUOTE_CAUTIONS, { width })

  return sheet.finish(quote.number)
}
