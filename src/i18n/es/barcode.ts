// Códigos de barras impresos (etiquetas, hojas de preparación, recepción).
export default {
  tooLong: 'Demasiado largo para imprimirse legible en este espacio: elija una etiqueta más grande.',
}
