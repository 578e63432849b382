// Words that only assistive technology reads (screen readers, voice control), and labels of controls whose
// visible words are elsewhere (a column header, a placeholder).
export default {
  skipToContent: 'Skip to the main content',
  accountMenu: 'account menu',
  picked: '{list}: {done} of {total} units picked',
  pageSize: 'Rows per page',
  perPage: '{n} a page',
  chooseFile: 'Spreadsheet file to upload',
  statusFilter: 'Filter by status',
  activeFilter: 'Show accounts',
  warehouseFilter: 'Filter by warehouse',
  warehouse: 'Warehouse',
  bin: 'Bin',
  vendor: 'Vendor',
  wallName: 'Wall name',
  item: 'Item',
  looseQty: 'Quantity',
  looseNote: 'Note',
  ruleText: 'Rule settings (JSON)',
  ruleInUse: 'Rule {id} in use',
  packsOrdered: 'Packs ordered, line {n}',
  unitCost: 'Unit cost, line {n}',
}
