export default {
  valuation: {
    title: 'Valor del inventario',
    asOf: 'Al cierre del',
    warehouse: 'Almacén',
    allWarehouses: 'Todos los almacenes',
    blurb: 'Unidades en existencia al cierre del día, en su zona horaria, cada una al costo promedio móvil que tenía entonces, calculado de nuevo a partir de los movimientos de inventario.',
    total: 'Valor del inventario al cierre del {day}: {value}',
    empty: 'No había existencias al cierre del {day}.',
    warehouseTotal: '{code}: {value}',
    col: { warehouse: 'Almacén', family: 'Familia', items: 'Artículos', onHand: 'Unidades en existencia', value: 'Valor' },
  },
}
