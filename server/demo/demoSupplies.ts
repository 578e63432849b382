// Everything a block wall needs besides blocks: spacers, sealant, grout, anchors, screws, strips,
// shop-built sections, made-to-order shower bases and small accessories. Invented products.
import { MM_PER_INCH, ML_PER_US_FL_OZ } from '../../shared/units.js'
import { demoGtin } from './demoBlocks.js'
import type { DemoItem } from './demoItemTypes.js'

const JOINT_1_8_IN = (MM_PER_INCH / 8).toFixed(3) // 1/8 in spacer joint (common practice)
const TUBE_ML = (10.1 * ML_PER_US_FL_OZ).toFixed(1) // 10.1 US fl oz cartridge = 298.7 mL (NIST SP 811 factor)

type Row = DemoItem['row']
const item = (row: Row, popularity: number, lineQty: [number, number]): DemoItem => ({ row, popularity, lineQty })

function spacers(): DemoItem[] {
  const joint = { jointMm: JOINT_1_8_IN }
  return [
    item({ sku: 'SP-STD-125', name: 'Joint spacer, standard units, 1/8 in joint', family: 'spacer', stockUnit: 'each', caseQty: 100, cost: '0.3100', listPrice: '0.65', weightKg: '0.012', gtin: demoGtin(901), ...joint }, 6, [20, 300]),
    item({ sku: 'SP-THN-125', name: 'Joint spacer, thin units, 1/8 in joint', family: 'spacer', stockUnit: 'each', caseQty: 100, cost: '0.2900', listPrice: '0.60', weightKg: '0.010', gtin: demoGtin(902), ...joint }, 2.5, [20, 200]),
    item({ sku: 'SP-EDG-STD', name: 'Edge spacer, standard units (perimeter)', family: 'spacer', stockUnit: 'each', caseQty: 50, cost: '0.4200', listPrice: '0.85', weightKg: '0.015', ...joint }, 3, [10, 120]),
    item({ sku: 'SP-EDG-THN', name: 'Edge spacer, thin units (perimeter)', family: 'spacer', stockUnit: 'each', caseQty: 50, cost: '0.4000', listPrice: '0.80', weightKg: '0.013', ...joint }, 1.2, [10, 80]),
    item({ sku: 'SP-ARC-STD', name: 'Arc spacer for curved walls, standard units', family: 'arc_spacer', stockUnit: 'each', caseQty: 50, cost: '0.6800', listPrice: '1.35', weightKg: '0.016', ...joint }, 1, [10, 80]),
    item({ sku: 'SP-ARC-THN', name: 'Arc spacer for curved walls, thin units', family: 'arc_spacer', stockUnit: 'each', caseQty: 50, cost: '0.6500', listPrice: '1.30', weightKg: '0.014', ...joint }, 0.5, [10, 60]),
    item({ sku: 'SP-ARC-ADJ', name: 'Adjustable arc spacer, tight radius', family: 'arc_spacer', stockUnit: 'each', caseQty: 25, cost: '0.9500', listPrice: '1.95', weightKg: '0.018', ...joint }, 0.3, [6, 40]),
    item({ sku: 'SP-BASE-STD', name: 'Spacer base strip, standard units, per foot', family: 'spacer', stockUnit: 'foot', caseQty: 40, cost: '0.8800', listPrice: '1.75', weightKg: '0.060' }, 2, [4, 40]),
    item({ sku: 'SP-BASE-THN', name: 'Spacer base strip, thin units, per foot', family: 'spacer', stockUnit: 'foot', caseQty: 40, cost: '0.8200', listPrice: '1.65', weightKg: '0.050' }, 0.8, [4, 30]),
  ]
}

function sealantsAndGrout(): DemoItem[] {
  const tube = { stockUnit: 'tube' as const, caseQty: 12, cartridgeMl: TUBE_ML, weightKg: '0.370' }
  return [
    item({ sku: 'SE-SIL-CLR', name: 'Silicone sealant, clear, 10.1 fl oz tube', family: 'sealant', cost: '6.1000', listPrice: '11.95', gtin: demoGtin(911), ...tube }, 5, [1, 12]),
    item({ sku: 'SE-SIL-WHT', name: 'Silicone sealant, white, 10.1 fl oz tube', family: 'sealant', cost: '6.1000', listPrice: '11.95', gtin: demoGtin(912), ...tube }, 4, [1, 12]),
    item({ sku: 'SE-SIL-GRY', name: 'Silicone sealant, grey, 10.1 fl oz tube', family: 'sealant', cost: '6.3000', listPrice: '12.45', ...tube }, 1.5, [1, 8]),
    item({ sku: 'SE-SIL-BLK', name: 'Silicone sealant, black, 10.1 fl oz tube', family: 'sealant', cost: '6.3000', listPrice: '12.45', ...tube }, 0.5, [1, 6]),
    item({ sku: 'SE-SIL-ALM', name: 'Silicone sealant, almond, 10.1 fl oz tube', family: 'sealant', cost: '6.3000', listPrice: '12.45', ...tube }, 0.6, [1, 6]),
    // Yields per bag are the demo's own figures (from memory: a 50 lb mortar bag fills roughly 0.45 ft³).
    item({ sku: 'GR-MOR-WHT50', name: 'Glass block mortar mix, white, 50 lb bag', family: 'grout', stockUnit: 'bag', caseQty: null, palletQty: 56, cost: '17.4000', listPrice: '29.95', weightKg: '22.680', groutYieldMl: '12700.00', gtin: demoGtin(921) }, 2, [1, 10]),
    item({ sku: 'GR-MOR-GRY50', name: 'Glass block mortar mix, grey, 50 lb bag', family: 'grout', stockUnit: 'bag', caseQty: null, palletQty: 56, cost: '15.9000', listPrice: '27.95', weightKg: '22.680', groutYieldMl: '12700.00' }, 0.8, [1, 8]),
    item({ sku: 'GR-JNT-WHT10', name: 'Joint grout for spacer walls, white, 10 lb bag', family: 'grout', stockUnit: 'bag', caseQty: 4, cost: '9.2000', listPrice: '16.95', weightKg: '4.536', groutYieldMl: '2600.00' }, 2.5, [1, 6]),
    item({ sku: 'GR-JNT-BRT10', name: 'Joint grout for spacer walls, bright white, 10 lb bag', family: 'grout', stockUnit: 'bag', caseQty: 4, cost: '9.6000', listPrice: '17.45', weightKg: '4.536', groutYieldMl: '2600.00' }, 0.7, [1, 4]),
    item({ sku: 'GR-JNT-GRY10', name: 'Joint grout for spacer walls, grey, 10 lb bag', family: 'grout', stockUnit: 'bag', caseQty: 4, cost: '9.2000', listPrice: '16.95', weightKg: '4.536', groutYieldMl: '2600.00' }, 1, [1, 4]),
  ]
}

function anchorsAndFasteners(): DemoItem[] {
  return [
    item({ sku: 'AN-PNL-24', name: 'Panel anchor, stainless, 24 × 1 3/4 in', family: 'anchor', stockUnit: 'each', caseQty: 25, cost: '2.1500', listPrice: '4.25', weightKg: '0.120', gtin: demoGtin(931) }, 2.5, [4, 40]),
    item({ sku: 'AN-PNL-16', name: 'Panel anchor, stainless, 16 × 1 3/4 in', family: 'anchor', stockUnit: 'each', caseQty: 25, cost: '1.7500', listPrice: '3.45', weightKg: '0.085' }, 1, [4, 24]),
    item({ sku: 'AN-PNL-12', name: 'Panel anchor, stainless, 12 × 1 3/4 in', family: 'anchor', stockUnit: 'each', caseQty: 25, cost: '1.3500', listPrice: '2.75', weightKg: '0.065' }, 0.6, [4, 24]),
    item({ sku: 'AN-CLP-STD', name: 'Stainless anchor clip for spacer walls, standard units', family: 'anchor', stockUnit: 'each', caseQty: 50, cost: '0.9500', listPrice: '1.95', weightKg: '0.030' }, 2, [4, 40]),
    item({ sku: 'AN-CLP-THN', name: 'Stainless anchor clip for spacer walls, thin units', family: 'anchor', stockUnit: 'each', caseQty: 50, cost: '0.9200', listPrice: '1.90', weightKg: '0.026' }, 0.8, [4, 30]),
    item({ sku: 'FS-SCR-300', name: 'Stainless screw #10 × 3 in, pan head', family: 'fastener', stockUnit: 'each', caseQty: 100, cost: '0.1900', listPrice: '0.40', weightKg: '0.008', gtin: demoGtin(941) }, 3, [10, 100]),
    item({ sku: 'FS-SCR-125', name: 'Stainless screw #8 × 1 1/4 in, flat head', family: 'fastener', stockUnit: 'each', caseQty: 100, cost: '0.0900', listPrice: '0.20', weightKg: '0.004' }, 1.5, [10, 100]),
    item({ sku: 'FS-WSH-010', name: 'Stainless washer #10', family: 'fastener', stockUnit: 'each', caseQty: 100, cost: '0.0500', listPrice: '0.12', weightKg: '0.001' }, 1, [10, 100]),
    item({ sku: 'FS-SCR-200', name: 'Stainless screw #10 × 2 in, pan head', family: 'fastener', stockUnit: 'each', caseQty: 100, cost: '0.1500', listPrice: '0.32', weightKg: '0.006' }, 0.8, [10, 100]),
    item({ sku: 'FS-PLG-025', name: 'Masonry plug, 1/4 in, for 3 in screws', family: 'fastener', stockUnit: 'each', caseQty: 100, cost: '0.0700', listPrice: '0.15', weightKg: '0.002' }, 2, [10, 100]),
  ]
}

function stripsAndAccessories(): DemoItem[] {
  return [
    item({ sku: 'AC-EXP-0375', name: 'Expansion strip, 3/8 × 4 in, per foot', family: 'accessory', stockUnit: 'foot', caseQty: 50, cost: '0.7400', listPrice: '1.45', weightKg: '0.020', description: 'Keeps the head and jambs free of mortar; at least 3/8 in wide.' }, 2.5, [8, 60]),
    item({ sku: 'AC-EXP-0375T', name: 'Expansion strip, 3/8 × 3 1/4 in, per foot, thin units', family: 'accessory', stockUnit: 'foot', caseQty: 50, cost: '0.7000', listPrice: '1.40', weightKg: '0.018' }, 1, [8, 40]),
    item({ sku: 'AC-LAD-8FT', name: 'Joint reinforcement ladder, 8 ft length', family: 'accessory', stockUnit: 'piece', caseQty: 10, cost: '4.4000', listPrice: '8.45', weightKg: '0.700' }, 1.5, [2, 16]),
    item({ sku: 'AC-VNT-0808', name: 'Ventilating insert, fits 8×8 in opening', family: 'accessory', stockUnit: 'each', cost: '38.0000', listPrice: '69.00', weightKg: '1.900' }, 0.4, [1, 2]),
    item({ sku: 'AC-CHN-8FT', name: 'Perimeter channel, white vinyl, 8 ft', family: 'accessory', stockUnit: 'piece', caseQty: 10, cost: '6.8000', listPrice: '12.95', weightKg: '0.900' }, 0.8, [1, 8]),
    item({ sku: 'AC-SIL-RED', name: 'Spacer joint filler rod, 1/8 in, per foot', family: 'accessory', stockUnit: 'foot', caseQty: 100, cost: '0.1800', listPrice: '0.40', weightKg: '0.002' }, 0.8, [10, 100]),
    item({ sku: 'AC-CLN-GLS', name: 'Glass block cleaning pads, pack of 10', family: 'accessory', stockUnit: 'each', cost: '3.9000', listPrice: '7.95', weightKg: '0.150' }, 0.5, [1, 3]),
    item({ sku: 'AC-TOOL-JNT', name: 'Joint striking tool, 1/4 in', family: 'accessory', stockUnit: 'each', cost: '4.2000', listPrice: '8.95', weightKg: '0.100' }, 0.3, [1, 2]),
    item({ sku: 'AC-GUN-10', name: 'Cartridge gun for 10.1 fl oz tubes', family: 'accessory', stockUnit: 'each', cost: '7.5000', listPrice: '14.95', weightKg: '0.450' }, 0.5, [1, 2]),
    item({ sku: 'AC-WDG-PK', name: 'Plastic levelling wedges, pack of 50', family: 'accessory', stockUnit: 'each', cost: '5.1000', listPrice: '9.95', weightKg: '0.300' }, 0.6, [1, 4]),
    item({ sku: 'AC-GLV-CUT', name: 'Cut-resistant gloves, pair', family: 'accessory', stockUnit: 'each', cost: '6.4000', listPrice: '12.50', weightKg: '0.100', description: 'Handle cut or broken blocks with cut-resistant gloves and eye protection.' }, 0.6, [1, 4]),
  ]
}

function sectionsAndShowerBases(): DemoItem[] {
  const section = (sku: string, name: string, cost: string, list: string, kg: string) =>
    item({ sku, name, family: 'wall_section', stockUnit: 'each', cost, listPrice: list, weightKg: kg,
      description: 'Shop-built panel. Heavy: lift with two people or a lifting aid; set and anchor to local code.' }, 0.15, [1, 2])
  const base = (sku: string, name: string, cost: string, list: string, kg: string) =>
    item({ sku, name, family: 'shower_base', stockUnit: 'each', cost, listPrice: list, weightKg: kg, madeToOrder: true,
      description: 'Made to order for the job, to be tiled over. Wet area: follow the waterproofing maker’s instructions and local code.' }, 0, [1, 1])
  return [
    section('WS-0808-WV-4X6', 'Wall section, 8×8 Wavy, 4 blocks × 6 courses', '236.0000', '419.00', '74.000'),
    section('WS-0808-CL-4X6', 'Wall section, 8×8 Clear, 4 blocks × 6 courses', '228.0000', '405.00', '74.000'),
    section('WS-0808-FR-3X5', 'Wall section, 8×8 Frosted, 3 blocks × 5 courses', '198.0000', '352.00', '47.000'),
    section('WS-0606-WV-5X8', 'Wall section, 6×6 Wavy, 5 blocks × 8 courses', '262.0000', '465.00', '77.000'),
    section('WS-0808-WV-6X6', 'Wall section, 8×8 Wavy, 6 blocks × 6 courses', '348.0000', '619.00', '110.000'),
    section('WS-M190-CL-4X6', 'Wall section, 190×190 mm Clear, 4 blocks × 6 courses', '219.0000', '389.00', '60.000'),
    section('WS-0408-WV-2X10', 'Wall section, 4×8 Wavy, 2 blocks × 10 courses', '154.0000', '275.00', '36.000'),
    base('SB-3648-L', 'Shower base for tiling, made to order, 36 × 48 in, curb opening left', '212.0000', '389.00', '18.000'),
    base('SB-3648-R', 'Shower base for tiling, made to order, 36 × 48 in, curb opening right', '212.0000', '389.00', '18.000'),
    base('SB-4260-C', 'Shower base for tiling, made to order, 42 × 60 in, centre drain', '268.0000', '489.00', '24.000'),
    base('SB-3060-L', 'Shower base for tiling, made to order, 30 × 60 in, curb opening left', '236.0000', '429.00', '20.000'),
    base('SB-3636-CRV', 'Shower base for tiling, made to order, 36 × 36 in, curved block wall', '248.0000', '455.00', '17.000'),
  ]
}

export function demoSupplies(): DemoItem[] {
  return [...spacers(), ...sealantsAndGrout(), ...anchorsAndFasteners(), ...stripsAndAccessories(), ...sectionsAndShowerBases()]
}
