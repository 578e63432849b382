// What a vendor reads about an order, whatever the medium (sheet, PDF, e-mail): who orders (the company
// profile and the buyer), where to bill and deliver, by when, and each line with its full specification
// written in the company's document unit. One model, so the three documents never disagree.
import type { DataSource, EntityManager } from 'typeorm'
import type { CompanyProfile } from '../../../shared/schemas/purchasing.js'
import type { PoDetail, PoLineView } from '../../../shared/schemas/purchasingViews.js'
import { specText } from '../../../shared/purchasing/specText.js'
import { companyLogo, companyProfile } from '../companyProfile.js'
import { poDetail } from './poRead.js'

type Db = EntityManager | DataSource

export interface PoPaperLine extends PoLineView {
  /** The whole made-to-order specification in the document's unit; never shortened. */
  specification: string | null
}

export interface PoPaper {
  po: PoDetail
  /** Whether the paper's reader may see costs: its prices and totals are printed only then (services/costVisibility.ts). */
  costs: boolean
  lines: PoPaperLine[]
  company: CompanyProfile
  /** The company's logo for the printed order, when one is set. */
  logo: { type: string; data: Buffer } | null
  /** The person ordering: whoever sends it, else who approved it, else who drafted it. */
  buyer: { name: string; email: string | null } | null
  /** Where the vendor's answer goes: the company's reply-to, else the buyer's own address. */
  replyTo: string | null
  /** Bill to and deliver to, as printed. */
  billTo: string
  shipTo: string
}

export async function poPaper(db: Db, poId: number, costs: boolean, senderId?: number | null): Promise<PoPaper> {
  const po = await poDetail(db, poId)
  const company = await companyProfile(db)
  const [who]: { approved_by: number | null; created_by: number | null }[] = await db.query(
    'SELECT approved_by, created_by FROM purchase_orders WHERE id = ?', [poId])
  const buyerId = senderId ?? who?.approved_by ?? who?.created_by ?? null
  const [user]: { display_name: string; email: string | null }[] = buyerId
    ? await db.query('SELECT display_name, email FROM users WHERE id = ?', [buyerId])
    : []
  const buyer = user ? { name: user.display_name, email: user.email } : null
  const warehouse = [company.legalName ? `${company.legalName}, ${po.warehouse.name}` : po.warehouse.name, po.warehouse.address ?? company.shipToAddress]
  return {
    po,
    costs,
    lines: po.lines.map((l) => ({ ...l, specification: specText(l.spec, company.documentUnit) })),
    company,
    logo: await companyLogo(db),
    buyer,
    replyTo: company.replyTo ?? buyer?.email ?? null,
    billTo: [company.legalName, company.billToAddress].filter(Boolean).join('\n'),
    shipTo: warehouse.filter(Boolean).join('\n'),
  }
}

/** "Jordan Reyes, jordan@…" for the documents' buyer line. */
export const buyerLine = (paper: PoPaper) =>
  paper.buyer ? [paper.buyer.name, paper.buyer.email].filter(Boolean).join(', ') : null
