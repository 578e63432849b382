// The company profile: one row (id 1) saying who orders. Purchase order documents read it; admins edit it.
import type { DataSource, EntityManager } from 'typeorm'
import type { CompanyProfile, CompanyProfileInput } from '../../shared/schemas/purchasing.js'
import { audit, type AuditActor } from './auditService.js'

type Db = EntityManager | DataSource

interface ProfileRow {
  legal_name: string; bill_to_address: string | null; ship_to_address: string | null; phone: string | null; email: string | null
  reply_to: string | null; tax_number: string | null; document_unit: 'in' | 'mm'
}

export async function companyProfile(db: Db): Promise<CompanyProfile> {
  const [r]: ProfileRow[] = await db.query('SELECT * FROM company_profile WHERE id = 1')
  const profile: CompanyProfileInput = {
    legalName: r?.legal_name ?? '', billToAddress: r?.bill_to_address ?? '', shipToAddress: r?.ship_to_address ?? null, phone: r?.phone ?? null,
    email: r?.email ?? null, replyTo: r?.reply_to ?? null, taxNumber: r?.tax_number ?? null, documentUnit: r?.document_unit ?? 'in',
  }
  return { ...profile, complete: !!profile.legalName && !!profile.billToAddress }
}

export async function updateCompanyProfile(ds: DataSource, actor: AuditActor, input: CompanyProfileInput): Promise<CompanyProfile> {
  return ds.transaction(async (em) => {
    const values = [input.legalName, input.billToAddress, input.shipToAddress, input.phone, input.email, input.replyTo, input.taxNumber, input.documentUnit, actor.userId]
    await em.query(
      `INSERT INTO company_profile (id, legal_name, bill_to_address, ship_to_address, phone, email, reply_to, tax_number, document_unit, updated_by)
       VALUES (1, ?, ?, ?, ?, ?, ?, ?, ?, ?)
       ON DUPLICATE KEY UPDATE legal_name = VALUES(legal_name), bill_to_address = VALUES(bill_to_address), ship_to_address = VALUES(ship_to_address),
         phone = VALUES(phone), email = VALUES(email), reply_to = VALUES(reply_to), tax_number = VALUES(tax_number),
         document_unit = VALUES(document_unit), updated_by = VALUES(updated_by)`,
      values,
    )
    await audit(em, actor, 'settings.company_profile', 'company_profile', 1, input)
    return companyProfile(em)
  })
}

/** The logo every document may carry (PNG or JPEG), kept on the profile row. */
export async function setCompanyLogo(ds: DataSource, actor: AuditActor, image: { type: string; data: Buffer }): Promise<void> {
  await ds.transaction(async (em) => {
    await em.query(
      "INSERT INTO company_profile (id, legal_name, logo, logo_type, updated_by) VALUES (1, '', ?, ?, ?) ON DUPLICATE KEY UPDATE logo = VALUES(logo), logo_type = VALUES(logo_type), updated_by = VALUES(updated_by)",
      [image.data, image.type, actor.userId],
    )
    await audit(em, actor, 'settings.company_logo', 'company_profile', 1, { type: image.type, bytes: image.data.length })
  })
}

export async function companyLogo(db: Db): Promise<{ type: string; data: Buffer } | null> {
  const [r]: { logo: Buffer | null; logo_type: string | null }[] = await db.query('SELECT logo, logo_type FROM company_profile WHERE id = 1')
  return r?.logo && r.logo_type ? { type: r.logo_type, data: r.logo } : null
}
