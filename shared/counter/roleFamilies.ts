// Which catalog families may fill each material role; the block picked on a wall fills 'block' itself.
import type { MaterialRole } from '../schemas/takeoff.js'

export type MappedRole = Exclude<MaterialRole, 'block'>

export const ROLE_FAMILIES: Record<MappedRole, readonly string[]> = {
  endBlock: ['glass_block'],
  doubleEndBlock: ['glass_block'],
  cornerBlock: ['glass_block'],
  angleBlock: ['glass_block'],
  spacer: ['spacer'],
  arcSpacer: ['arc_spacer', 'spacer'],
  spacerBase: ['spacer', 'accessory'],
  sealant: ['sealant'],
  grout: ['grout'],
  mortar: ['grout'],
  screw: ['fastener'],
  panelAnchor: ['anchor'],
  jointReinforcement: ['accessory'],
  expansionStrip: ['accessory', 'spacer'],
  wallSection: ['wall_section'],
  showerBase: ['shower_base'],
}

/** Roles whose rule works from a length: the item needs a piece length unless sold by the foot. */
export const LENGTH_ROLES: readonly MaterialRole[] = ['spacerBase', 'jointReinforcement', 'expansionStrip']
/** Roles whose rule works from a volume: the item needs a yield per bag. */
export const YIELD_ROLES: readonly MaterialRole[] = ['grout', 'mortar']
