// Cantidades en su unidad de existencias y pesos en la unidad de cada persona.
export default {
  qty: {
    each: '{n} ud. | {n} uds.',
    tube: '{n} tubo | {n} tubos',
    bag: '{n} bolsa | {n} bolsas',
    piece: '{n} pieza | {n} piezas',
    foot: '{n} pie | {n} pies',
  },
  /** The unit beside a number box. */
  name: { each: 'uds.', tube: 'tubos', bag: 'bolsas', piece: 'piezas', foot: 'pies' },
  weight: { lb: '{n} lb', kg: '{n} kg', under: 'menos de {weight}' },
}
