// Mensajes para las longitudes tal como se escriben (BaseLengthInput); las claves siguen a en/units.ts.
export default {
  parse: {
    empty: 'Escriba una longitud.',
    negative: 'Una longitud no puede ser negativa.',
    zero_denominator: 'Una fracción no puede tener 0 debajo de la línea.',
    decimal_comma: 'Escriba los decimales con punto (1.5) y sin separador de miles.',
    unreadable: 'Lumenyard no puede leer esto como una longitud. Pruebe 7 3/4", 7.75 in, 190 mm o 5\' 2".',
  },
}
