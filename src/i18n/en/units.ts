// Quantities in their stock unit and weights in the person's unit.
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
}
