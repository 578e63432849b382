export default {
  valuation: {
    title: 'Stock value',
    asOf: 'At the end of',
    warehouse: 'Warehouse',
    allWarehouses: 'All warehouses',
    blurb: 'Units on hand at the end of the day, in your time zone, each at the moving-average cost it had then, worked out again from the stock movements.',
    total: 'Stock value at the end of {day}: {value}',
    empty: 'Nothing was on hand at the end of {day}.',
    warehouseTotal: '{code}: {value}',
    col: { warehouse: 'Warehouse', family: 'Family', items: 'Items', onHand: 'Units on hand', value: 'Value' },
  },
}
