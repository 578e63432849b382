// Cantidades en su unidad de existencias y pesos en la unidad de cada persona; longitudes tal como se escriben (BaseLengthInput). Las claves siguen a en/units.ts.
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
  parse: {
    empty: 'Escriba una longitud.',
    negative: 'Una longitud no puede ser negativa.',
    zero_denominator: 'Una fracción no puede tener 0 debajo de la línea.',
    decimal_comma: 'Escriba los decimales con punto (1.5) y sin separador de miles.',
    unreadable: 'Lumenyard no puede leer esto como una longitud. Pruebe 7 3/4", 7.75 in, 190 mm o 5\' 2".',
  },
}
