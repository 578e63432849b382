// Item families by name in each language: the client's catalog messages (src/i18n/<lang>/catalog.ts) and the
// server's spreadsheets (report exports) use these same words.
import type { ItemFamily } from './catalog.js'

export const FAMILY_NAMES_EN: Record<ItemFamily, string> = {
  glass_block: 'Glass block', spacer: 'Spacer', arc_spacer: 'Arc spacer', sealant: 'Sealant', grout: 'Grout and mortar',
  anchor: 'Anchor', fastener: 'Fastener', shower_base: 'Shower base', wall_section: 'Wall section', accessory: 'Accessory',
}

export const FAMILY_NAMES_ES: Record<ItemFamily, string> = {
  glass_block: 'Bloque de vidrio', spacer: 'Separador', arc_spacer: 'Separador para curva', sealant: 'Sellador', grout: 'Boquilla y mortero',
  anchor: 'Anclaje', fastener: 'Tornillería', shower_base: 'Base de regadera', wall_section: 'Sección de muro', accessory: 'Accesorio',
}

export const FAMILY_NAMES: Record<'en' | 'es', Record<ItemFamily, string>> = { en: FAMILY_NAMES_EN, es: FAMILY_NAMES_ES }

/** A family's name in the language, or its stored code for a family this version does not know. */
export const familyName = (lang: 'en' | 'es', family: string): string => (FAMILY_NAMES[lang] as Record<string, string>)[family] ?? family
