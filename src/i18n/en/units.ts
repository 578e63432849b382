// Quantities in their stock unit and weights in the person's unit; lengths as people type them (BaseLengthInput), by the refusal's code in shared/units.ts.
export default {
  qty: {
    each: '{n} each | {n} each',
    tube: '{n} tube | {n} tubes',
    bag: '{n} bag | {n} bags',
    piece: '{n} piece | {n} pieces',
    foot: '{n} ft | {n} ft',
  },
  /** The unit beside a number box. */
  name: { each: 'each', tube: 'tubes', bag: 'bags', piece: 'pieces', foot: 'ft' },
  weight: { lb: '{n} lb', kg: '{n} kg', under: 'under {weight}' },
  parse: {
    empty: 'Type a length.',
    negative: 'A length cannot be negative.',
    zero_denominator: 'A fraction cannot have 0 below the line.',
    decimal_comma: 'Write decimals with a point (1.5) and no thousands separator.',
    unreadable: 'Lumenyard cannot read this as a length. Try 7 3/4", 7.75 in, 190 mm or 5\' 2".',
  },
}
