// The README workbook of the everything-out zip, and the guide sheet of each import template, in the reader's
// language. Their own labels are in README_WORDS (one set per language, the same keys); the texts the files'
// descriptions carry (what a file, a column or an import holds, what a template's column takes, what is left out
// and why) are written in English beside the code that makes each file, and README_SPANISH gives each one's
// Spanish, keyed by that English text. A unit test (tests/unit/readmeWords.test.ts)
// fails when a text the README writes has no Spanish here, or when one here is no longer written.
// Column names, file names, sheet tabs and the codes a column holds stay as the imports read them.

export type ReadmeLang = 'en' | 'es'

const EN = {
  columnsTab: 'Columns', columnsTitle: 'Lumenyard everything out: columns',
  file: 'File', sheet: 'Sheet', column: 'Column', meaning: 'Meaning', allowed: 'Allowed values or format', readBy: 'Read by an import',
  filesTab: 'Files', filesTitle: 'Lumenyard everything out: files', holds: 'What it holds', readBackBy: 'Read back by',
  leftOutTab: 'Left out', leftOutTitle: 'Lumenyard everything out: left out on purpose', table: 'Table', why: 'Why it has no file',
  aboutTab: 'About', aboutTitle: 'Lumenyard everything out',
  written: 'Written (UTC)',
  momentLabel: 'Moment', moment: 'Every file was read from one moment of the database.',
  filesLabel: 'Files', files: 'Each .xlsx file holds one kind of record on one sheet; the first row names the columns.',
  readingBackLabel: 'Reading back',
  readingBack: 'Files whose columns an import reads (the Columns sheet says which) can be brought into another Lumenyard as they are: Admin → Bring your data in, or Stock → Import items. Columns no import reads are skipped.',
  unitsLabel: 'Units',
  units: 'Times are UTC; days are YYYY-MM-DD; quantities are in each item\'s stock unit; lengths in takeoffs are millimetres; costs and prices carry no currency sign.',
  notIncludedLabel: 'Not included', notIncluded: 'No passwords, password hashes, sign-in sessions or card numbers.',
  yesThe: 'yes: the {name}', no: 'no', the: 'the {name}', noImport: 'no import',
  oneOf: 'One of: {values}.',
  integer: 'Whole number.', decimal: 'Number.', decimalPlaces: 'Number, {places} decimal places.', money: 'Amount with 2 decimals, no currency sign.',
  cost: 'Amount with up to 4 decimals, no currency sign.', boolean: 'yes or no.', date: 'A day, YYYY-MM-DD.', datetime: 'Date and time in UTC, YYYY-MM-DD hh:mm.', text: 'Text.',
  guideTab: 'Columns', guideColumn: 'Column', guideRequired: 'Required', guideKind: 'Kind', guideAllowed: 'Allowed values', guideYes: 'yes', guideRows: '(rows)',
  kindText: 'text', kindNumber: 'number', kindWhole: 'whole number', kindYesNo: 'yes / no',
  templateRows: 'At most {max} rows per file. The same file imported twice changes nothing the second time.',
  itemTemplateRows: 'At most {max} rows per file. A row whose SKU exists updates that item.',
}

export const README_WORDS: Record<ReadmeLang, typeof EN> = {
  en: EN,
  es: {
    columnsTab: 'Columnas', columnsTitle: 'Lumenyard, todo afuera: columnas',
    file: 'Archivo', sheet: 'Hoja', column: 'Columna', meaning: 'Significado', allowed: 'Valores permitidos o formato', readBy: 'Lo lee una importación',
    filesTab: 'Archivos', filesTitle: 'Lumenyard, todo afuera: archivos', holds: 'Qué contiene', readBackBy: 'Lo vuelve a leer',
    leftOutTab: 'Excluido', leftOutTitle: 'Lumenyard, todo afuera: lo excluido a propósito', table: 'Tabla', why: 'Por qué no tiene archivo',
    aboutTab: 'Acerca de', aboutTitle: 'Lumenyard, todo afuera',
    written: 'Escrito (UTC)',
    momentLabel: 'Momento', moment: 'Todos los archivos se leyeron de un mismo momento de la base de datos.',
    filesLabel: 'Archivos', files: 'Cada archivo .xlsx contiene un tipo de registro en una hoja; la primera fila nombra las columnas.',
    readingBackLabel: 'Volver a traerlo',
    readingBack: 'Los archivos cuyas columnas lee una importación (la hoja Columnas dice cuáles) se pueden traer tal cual a otro Lumenyard: Administración → Traiga sus datos, o Existencias → Importar artículos. Las columnas que ninguna importación lee se omiten.',
    unitsLabel: 'Unidades',
    units: 'Las horas están en UTC; los días, como AAAA-MM-DD (YYYY-MM-DD); las cantidades, en la unidad de existencia de cada artículo; las longitudes de los cálculos, en milímetros; costos y precios no llevan signo de moneda.',
    notIncludedLabel: 'No incluido', notIncluded: 'Ni contraseñas, ni sus hashes, ni sesiones iniciadas, ni números de tarjeta.',
    yesThe: 'sí: la {name}', no: 'no', the: 'la {name}', noImport: 'ninguna importación',
    oneOf: 'Uno de: {values}.',
    integer: 'Número entero.', decimal: 'Número.', decimalPlaces: 'Número, {places} decimales.', money: 'Importe con 2 decimales, sin signo de moneda.',
    cost: 'Importe con hasta 4 decimales, sin signo de moneda.', boolean: 'yes o no (sí o no).', date: 'Un día, AAAA-MM-DD (YYYY-MM-DD).', datetime: 'Fecha y hora en UTC, AAAA-MM-DD hh:mm.', text: 'Texto.',
    guideTab: 'Columnas', guideColumn: 'Columna', guideRequired: 'Obligatoria', guideKind: 'Tipo', guideAllowed: 'Valores permitidos', guideYes: 'sí', guideRows: '(filas)',
    kindText: 'texto', kindNumber: 'número', kindWhole: 'número entero', kindYesNo: 'yes / no (sí / no)',
    templateRows: 'Como máximo {max} filas por archivo. El mismo archivo importado dos veces no cambia nada la segunda vez.',
    itemTemplateRows: 'Como máximo {max} filas por archivo. Una fila cuyo SKU ya existe actualiza ese artículo.',
  },
}

/** The README's words in one language, `{name}`-style values filled in. */
export function readmeWord(lang: ReadmeLang, key: keyof typeof EN, values: Record<string, string | number> = {}): string {
  return README_WORDS[lang][key].replace(/\{(\w+)\}/g, (_m, k: string) => String(values[k] ?? `{${k}}`))
}

/** A description written in English beside its file, in `lang`: Spanish from README_SPANISH (English when none). */
export const readmeText = (lang: ReadmeLang, english: string): string => (lang === 'es' ? README_SPANISH[english] ?? english : english)

/** The Spanish of every description the README writes, keyed by its English. */
export const README_SPANISH: Readonly<Record<string, string>> = {
  'The catalog, one row per item, in the columns of the item import (Stock → Import items reads this file back).':
    'El catálogo, una fila por artículo, en las columnas de la importación de artículos (Existencias → Importar artículos vuelve a leer este archivo).',
  'As in the item import template (required there).':
    'Como en la plantilla de la importación de artículos (obligatoria allí).',
  'item import':
    'importación de artículos',
  'glass_block, spacer, arc_spacer, sealant, grout, anchor, fastener, shower_base, wall_section, accessory':
    'glass_block, spacer, arc_spacer, sealant, grout, anchor, fastener, shower_base, wall_section, accessory (códigos de familia)',
  'each, tube, bag, piece, foot':
    'each, tube, bag, piece, foot (códigos de unidad)',
  'As in the item import template.':
    'Como en la plantilla de la importación de artículos.',
  'yes or no; blank keeps the item’s value (a new item: no)':
    'yes o no; en blanco conserva el valor del artículo (un artículo nuevo: no)',
  '8, 12, 13 or 14 digits with a valid GS1 check digit; format the column as text to keep leading zeros':
    '8, 12, 13 o 14 dígitos con un dígito de control GS1 válido; dé formato de texto a la columna para conservar los ceros a la izquierda',
  'Up to 4 decimals, no currency sign':
    'Hasta 4 decimales, sin signo de moneda',
  'Up to 2 decimals, no currency sign':
    'Hasta 2 decimales, sin signo de moneda',
  'standard, thin (standard ≥ 3 7/8 in, thin ≥ 3 1/8 in thick, IRC R607.3)':
    'standard, thin (standard ≥ 3 7/8 pulg., thin ≥ 3 1/8 pulg. de espesor, IRC R607.3)',
  'clear, frosted, wavy, rippled, fluted, dimpled, prism, tinted, or a pattern of your own (letters, digits, space, - and _)':
    'clear, frosted, wavy, rippled, fluted, dimpled, prism, tinted, o un diseño propio (letras, dígitos, espacio, - y _)',
  'square, rectangle, end_finish, double_end_finish, corner, angle_45':
    'square, rectangle, end_finish, double_end_finish, corner, angle_45 (códigos de forma)',
  'Each warehouse.':
    'Cada almacén.',
  'The warehouse code used in every other file.':
    'El código del almacén que usan todos los demás archivos.',
  'Its name.':
    'Su nombre.',
  'Where it is.':
    'Dónde está.',
  'How its bin codes are made.':
    'Cómo se forman los códigos de sus ubicaciones.',
  'no: taken out of use.':
    'no: retirado del uso.',
  'Each bin of each warehouse.':
    'Cada ubicación de cada almacén.',
  'The warehouse code.':
    'El código del almacén.',
  'The bin code, unique within its warehouse.':
    'El código de la ubicación, único dentro de su almacén.',
  'What the bin is for; transit bins hold stock on the way between warehouses.':
    'Para qué sirve la ubicación; las ubicaciones de tránsito guardan existencias en camino entre almacenes.',
  'Production lots of items (blocks of one lot share a tint).':
    'Lotes de producción de los artículos (los bloques de un mismo lote comparten el tono).',
  'The item.':
    'El artículo.',
  'The lot code as printed by the maker.':
    'El código del lote tal como lo imprime el fabricante.',
  'When it first came in (UTC).':
    'Cuándo entró por primera vez (UTC).',
  'Who supplied it, when known.':
    'Quién lo suministró, si se sabe.',
  'A note on the lot\'s tint.':
    'Una nota sobre el tono del lote.',
  'Stock on hand by item, warehouse, bin and lot at each item\'s average cost in that warehouse, in the columns of the opening-stock import (Admin → Bring your data in reads this file back). Stock on the way between warehouses is in stock-on-the-way.xlsx.':
    'Existencias por artículo, almacén, ubicación y lote al costo promedio de cada artículo en ese almacén, en las columnas de la importación de existencias iniciales (Administración → Traiga sus datos vuelve a leer este archivo). Las existencias en camino entre almacenes están en stock-on-the-way.xlsx.',
  'An item already in the catalog (import items first).':
    'Un artículo que ya está en el catálogo (importe antes los artículos).',
  'opening stock import':
    'importación de existencias iniciales',
  'A warehouse code, as set up under Warehouses.':
    'Un código de almacén, tal como está en Almacenes.',
  'The bin code.':
    'El código de la ubicación.',
  'A storage, receiving or staging bin of that warehouse (not an on-the-way bin).':
    'Una ubicación de almacenaje, recepción o preparación de ese almacén (no una de tránsito).',
  'The production lot (blank: not kept by lot).':
    'El lote de producción (en blanco: no se lleva por lote).',
  'The production lot. Required for items matched by lot (blocks: one job is picked from one run, so the tint matches).':
    'El lote de producción. Obligatorio para los artículos que se igualan por lote (bloques: una obra se prepara de una sola tirada, para que el tono coincida).',
  'On hand, in the item\'s stock unit.':
    'En existencia, en la unidad de existencia del artículo.',
  'Whole stock units, or packs: "240", "3 cases", "1 pallet 2 cases 5" (the item\'s case and pallet sizes). A 0 row is skipped.':
    'Unidades de existencia enteras, o empaques: "240", "3 cases", "1 pallet 2 cases 5" (los tamaños de caja y tarima del artículo). Una fila con 0 se omite.',
  'The moving-average cost of one stock unit in that warehouse.':
    'El costo promedio móvil de una unidad de existencia en ese almacén.',
  'What one stock unit cost you, up to 4 decimals. The moving-average cost starts from it.':
    'Lo que le costó una unidad de existencia, hasta 4 decimales. El costo promedio móvil parte de él.',
  'Quantity × unit cost (the import skips this column).':
    'Cantidad × costo unitario (la importación omite esta columna).',
  'Stock shipped from one warehouse and not yet put away at the other (in the transit bins).':
    'Existencias enviadas desde un almacén y aún no guardadas en el otro (en las ubicaciones de tránsito).',
  'The warehouse whose transit bin holds it.':
    'El almacén cuya ubicación de tránsito las guarda.',
  'The transit bin.':
    'La ubicación de tránsito.',
  'The production lot.':
    'El lote de producción.',
  'In the item\'s stock unit.':
    'En la unidad de existencia del artículo.',
  'Per item and warehouse: the moving-average cost and the manual minimum, in the columns of the averages and minimums import (read back after the stock, it keeps the average of a warehouse that holds none of the item now).':
    'Por artículo y almacén: el costo promedio móvil y el mínimo fijado a mano, en las columnas de la importación de costos promedio y mínimos (leído después de la existencia, guarda el promedio de un almacén que hoy no tiene el artículo).',
  'Moving-average cost of one stock unit.':
    'Costo promedio móvil de una unidad de existencia.',
  'The minimum set by hand (blank: none).':
    'El mínimo fijado a mano (en blanco: ninguno).',
  'Stock movements: every move of stock, oldest first. The sum of a bin\'s moves is its stock.':
    'Movimientos de existencias: cada movimiento, del más antiguo al más reciente. La suma de los movimientos de una ubicación es su existencia.',
  'The move\'s number.':
    'El número del movimiento.',
  'When (UTC).':
    'Cuándo (UTC).',
  'What moved the stock.':
    'Qué movió las existencias.',
  'Stock units in (positive) or out (negative).':
    'Unidades de existencia que entran (positivo) o salen (negativo).',
  'Cost of one stock unit on this move.':
    'Costo de una unidad de existencia en este movimiento.',
  'What the move belongs to (a receipt, a pick list, a count, a transfer…).':
    'A qué pertenece el movimiento (una recepción, una lista de preparación, un conteo, un traslado…).',
  'That document\'s number.':
    'El número de ese documento.',
  'Why (adjustments).':
    'Por qué (ajustes).',
  'A note typed with the move.':
    'Una nota escrita con el movimiento.',
  'Who made it (user name).':
    'Quién lo hizo (nombre de usuario).',
  'Usage per item, warehouse and day: the issues and picks of the ledger added to any usage history brought in earlier, in the columns of the usage-history import. Read back into another Lumenyard, its reorder points start from the same use.':
    'Consumo por artículo, almacén y día: las salidas y preparaciones del libro de movimientos sumadas al historial de consumo traído antes, en las columnas de la importación de historial de consumo. Leído en otro Lumenyard, sus puntos de reorden parten del mismo consumo.',
  'usage history import':
    'importación de historial de consumo',
  'The warehouse the units left from (its code).':
    'El almacén del que salieron las unidades (su código).',
  'The day, YYYY-MM-DD.':
    'El día, AAAA-MM-DD.',
  'The day of use, as YYYY-MM-DD. Give a day or a month on each row, not both.':
    'El día del consumo, como AAAA-MM-DD. Indique un día o un mes en cada fila, no ambos.',
  'Stock units used that day (issues and picks less what was put back the same way).':
    'Unidades de existencia usadas ese día (salidas y preparaciones menos lo devuelto por la misma vía).',
  'Units issued or sold, in the item\'s stock unit or packs ("3 cases"). A 0 row is skipped.':
    'Unidades entregadas o vendidas, en la unidad de existencia del artículo o en empaques ("3 cases"). Una fila con 0 se omite.',
  'Selling price levels an account can be given (the accounts file names them by code).':
    'Niveles de precios de venta que se pueden asignar a una cuenta (el archivo de cuentas los nombra por código).',
  'The level\'s code.':
    'El código del nivel.',
  'Percent off list price.':
    'Porcentaje de descuento sobre el precio de lista.',
  'no: no longer offered.':
    'no: ya no se ofrece.',
  'Contractor accounts with their price level and tax exemption, in the columns of the accounts import.':
    'Cuentas de contratistas con su nivel de precios y su exención de impuestos, en las columnas de la importación de cuentas.',
  'The account code.':
    'El código de la cuenta.',
  'Your code for the account: 2 to 20 letters, digits or dashes. A code already in Lumenyard is refused.':
    'Su código para la cuenta: de 2 a 20 letras, dígitos o guiones. Un código que ya está en Lumenyard se rechaza.',
  'accounts import':
    'importación de cuentas',
  'The contractor\'s name.':
    'El nombre del contratista.',
  'The contractor\'s name as it goes on quotes and pick lists.':
    'El nombre del contratista tal como va en las cotizaciones y listas de preparación.',
  'Who to ask for.':
    'Por quién preguntar.',
  'E-mail.':
    'Correo electrónico.',
  'Where quotes go.':
    'Adónde van las cotizaciones.',
  'Phone.':
    'Teléfono.',
  'Address.':
    'Dirección.',
  'Notes.':
    'Notas.',
  'The price level code (blank: list prices).':
    'El código del nivel de precios (en blanco: precios de lista).',
  'A price level code, as set up under Selling prices (blank: list prices).':
    'Un código de nivel de precios, tal como está en Precios de venta (en blanco: precios de lista).',
  'Tax-exempt certificate number.':
    'Número del certificado de exención de impuestos.',
  'The tax-exempt certificate number, when the contractor buys tax-free (up to 40 characters).':
    'El número del certificado de exención de impuestos, cuando el contratista compra sin impuestos (hasta 40 caracteres).',
  'Last day the certificate holds, YYYY-MM-DD.':
    'Último día de validez del certificado, AAAA-MM-DD.',
  'The last day the certificate holds, YYYY-MM-DD (optional).':
    'El último día de validez del certificado, AAAA-MM-DD (opcional).',
  'no: closed (the import skips this column).':
    'no: cerrada (la importación omite esta columna).',
  'Contractors\' jobs.':
    'Obras de los contratistas.',
  'Whose job.':
    'De quién es la obra.',
  'The job\'s name.':
    'El nombre de la obra.',
  'Where the work is.':
    'Dónde se hace el trabajo.',
  'Where the job stands.':
    'En qué estado está la obra.',
  'When it is due, YYYY-MM-DD.':
    'Para cuándo es, AAAA-MM-DD.',
  'When it was entered (UTC).':
    'Cuándo se registró (UTC).',
  'Vendors.':
    'Proveedores.',
  'The vendor code used in every other file.':
    'El código del proveedor que usan todos los demás archivos.',
  'Where orders go.':
    'Adónde van los pedidos.',
  'Payment terms.':
    'Condiciones de pago.',
  'The currency of its prices.':
    'La moneda de sus precios.',
  'Three-letter ISO 4217 code (USD, CAD…).':
    'Código ISO 4217 de tres letras (USD, CAD…).',
  'Usual days from order to arrival.':
    'Días habituales desde el pedido hasta la llegada.',
  'no: no longer bought from.':
    'no: ya no se le compra.',
  'What each vendor sells us, in the columns of the vendors-with-items import.':
    'Lo que cada proveedor nos vende, en las columnas de la importación de proveedores con sus artículos.',
  'The vendor code.':
    'El código del proveedor.',
  'Your code for the vendor (letters, digits, . _ -; up to 20). A code not yet in Lumenyard adds that vendor.':
    'Su código para el proveedor (letras, dígitos, . _ -; hasta 20). Un código que aún no está en Lumenyard agrega ese proveedor.',
  'vendors with their items import':
    'importación de proveedores con sus artículos',
  'The vendor\'s name.':
    'El nombre del proveedor.',
  'The vendor\'s name. Needed on the rows of a vendor not yet in Lumenyard; ignored for one already here.':
    'El nombre del proveedor. Necesario en las filas de un proveedor que aún no está en Lumenyard; se ignora para uno que ya está.',
  'Our item.':
    'Nuestro artículo.',
  'The vendor\'s own code for it.':
    'El código propio del proveedor para él.',
  'The vendor\'s own code for the item, as it goes on your purchase orders (up to 40 characters).':
    'El código propio del proveedor para el artículo, tal como va en sus órdenes de compra (hasta 40 caracteres).',
  'Stock units in one of the vendor\'s packs.':
    'Unidades de existencia en un empaque del proveedor.',
  'Stock units in one of the vendor\'s packs (blank: 1). Orders go out in whole packs.':
    'Unidades de existencia en un empaque del proveedor (en blanco: 1). Los pedidos salen en empaques enteros.',
  'The fewest packs the vendor takes an order for.':
    'La menor cantidad de empaques que el proveedor acepta en un pedido.',
  'The fewest packs the vendor takes on one order (blank: 1).':
    'La menor cantidad de empaques que el proveedor acepta en una orden (en blanco: 1).',
  'Cost of one stock unit from this vendor.':
    'Costo de una unidad de existencia de este proveedor.',
  'What one stock unit costs from this vendor, up to 4 decimals, no currency sign.':
    'Lo que cuesta una unidad de existencia de este proveedor, hasta 4 decimales, sin signo de moneda.',
  'Days from order to arrival for this item: its own, else the vendor\'s usual (what reorder points use).':
    'Días desde el pedido hasta la llegada de este artículo: el suyo propio, si no el habitual del proveedor (el que usan los puntos de reorden).',
  'Days from order to arrival for this item (blank: the vendor\'s usual lead time).':
    'Días desde el pedido hasta la llegada de este artículo (en blanco: el plazo de entrega habitual del proveedor).',
  'yes: the vendor reorder suggestions use for this item.':
    'yes: el proveedor que usan las sugerencias de reorden para este artículo.',
  'yes for the vendor reorder suggestions should buy this item from (one per item; blank: no).':
    'yes para el proveedor al que las sugerencias de reorden deben comprar este artículo (uno por artículo; en blanco: no).',
  'Lines of the orders approved or sent to vendors and not yet fully received (what is on order), in the columns of the open purchase orders import.':
    'Líneas de las órdenes aprobadas o enviadas a proveedores y aún no recibidas del todo (lo que está pedido), en las columnas de la importación de órdenes de compra abiertas.',
  'The order number.':
    'El número de la orden.',
  'Your order number; every line of one order carries it. A number already in Lumenyard is refused.':
    'Su número de orden; todas las líneas de una orden lo llevan. Un número que ya está en Lumenyard se rechaza.',
  'open purchase orders import':
    'importación de órdenes de compra abiertas',
  'warehouses import':
    'importación de almacenes',
  'bins import':
    'importación de ubicaciones',
  'averages and minimums import':
    'importación de costos promedio y mínimos',
  'price levels import':
    'importación de niveles de precio',
  'price rules import':
    'importación de reglas de precio',
  'vendors import':
    'importación de proveedores',
  'reorder settings import':
    'importación de ajustes de reposición',
  'lead times import':
    'importación de plazos de entrega',
  'sales tax import':
    'importación de impuestos sobre ventas',
  'A vendor code, as set up under Vendors (or brought in with the vendors import).':
    'Un código de proveedor, tal como está en Proveedores (o traído con la importación de proveedores).',
  'Where it arrives.':
    'Adónde llega.',
  'Where the order is to arrive (warehouse code). The same on every line of an order.':
    'Adónde debe llegar la orden (código de almacén). El mismo en todas las líneas de una orden.',
  'The day it was sent, YYYY-MM-DD.':
    'El día en que se envió, AAAA-MM-DD.',
  'The day the order went to the vendor, YYYY-MM-DD. Lead times are measured from it.':
    'El día en que la orden salió hacia el proveedor, AAAA-MM-DD. Los plazos de entrega se miden desde él.',
  'The day the vendor said, YYYY-MM-DD.':
    'El día que dijo el proveedor, AAAA-MM-DD.',
  'When the vendor said it arrives, YYYY-MM-DD (optional).':
    'Cuándo dijo el proveedor que llega, AAAA-MM-DD (opcional).',
  'Stock units ordered.':
    'Unidades de existencia pedidas.',
  'Stock units ordered on the line.':
    'Unidades de existencia pedidas en la línea.',
  'Stock units received so far.':
    'Unidades de existencia recibidas hasta ahora.',
  'Stock units already received (they are counted in your opening stock). An order fully received is not open: leave it out.':
    'Unidades de existencia ya recibidas (se cuentan en sus existencias iniciales). Una orden recibida del todo no está abierta: déjela fuera.',
  'Cost agreed per stock unit.':
    'Costo acordado por unidad de existencia.',
  'The price agreed with the vendor per stock unit, up to 4 decimals.':
    'El precio acordado con el proveedor por unidad de existencia, hasta 4 decimales.',
  'Every purchase order, whatever its status.':
    'Todas las órdenes de compra, en cualquier estado.',
  'The vendor.':
    'El proveedor.',
  'Where the order stands.':
    'En qué estado está la orden.',
  'The order\'s total.':
    'El total de la orden.',
  'When it was made (UTC).':
    'Cuándo se hizo (UTC).',
  'When it went to the vendor (UTC).':
    'Cuándo salió hacia el proveedor (UTC).',
  'Every line of every purchase order.':
    'Todas las líneas de todas las órdenes de compra.',
  'The order.':
    'La orden.',
  'The line\'s place on the order.':
    'El lugar de la línea en la orden.',
  'The vendor\'s code.':
    'El código del proveedor.',
  'As printed on the order.':
    'Como va impreso en la orden.',
  'Stock units per pack.':
    'Unidades de existencia por empaque.',
  'Packs ordered.':
    'Empaques pedidos.',
  'Stock units received.':
    'Unidades de existencia recibidas.',
  'Stock units that arrived damaged.':
    'Unidades de existencia que llegaron dañadas.',
  'What arrived against purchase orders, one row per line received.':
    'Lo que llegó contra órdenes de compra, una fila por línea recibida.',
  'Who received it.':
    'Quién lo recibió.',
  'Where it was put.':
    'Dónde se guardó.',
  'Stock units damaged.':
    'Unidades de existencia dañadas.',
  'Why the quantity differed, when it did.':
    'Por qué difirió la cantidad, cuando difirió.',
  'Quotes given to contractors.':
    'Cotizaciones dadas a contratistas.',
  'The quote number.':
    'El número de la cotización.',
  'Its revision.':
    'Su revisión.',
  'Where it stands.':
    'En qué estado está.',
  'For whom.':
    'Para quién.',
  'For which job.':
    'Para qué obra.',
  'Supplied from.':
    'Surtido desde.',
  'YYYY-MM-DD.':
    'AAAA-MM-DD.',
  'The price level used.':
    'El nivel de precios usado.',
  'Before tax.':
    'Antes de impuestos.',
  'Percent.':
    'Porcentaje.',
  'Tax.':
    'Impuesto.',
  'Subtotal plus tax.':
    'Subtotal más impuesto.',
  'Every line of every quote.':
    'Todas las líneas de todas las cotizaciones.',
  'The line\'s place.':
    'El lugar de la línea.',
  'As printed.':
    'Como va impreso.',
  'Stock units quoted.':
    'Unidades de existencia cotizadas.',
  'Packs, when sold by the pack.':
    'Empaques, cuando se vende por empaque.',
  'Price of one stock unit.':
    'Precio de una unidad de existencia.',
  'Quantity × price.':
    'Cantidad × precio.',
  'Takeoffs: what the contractor described for a job. Lengths are millimetres whatever unit the takeoff is shown in. Its walls and loose lines are in takeoff-walls.xlsx and takeoff-loose-lines.xlsx.':
    'Cálculos de materiales: lo que el contratista describió para una obra. Las longitudes están en milímetros, en cualquier unidad que se muestre el cálculo. Sus muros y líneas sueltas están en takeoff-walls.xlsx y takeoff-loose-lines.xlsx.',
  'The takeoff\'s number.':
    'El número del cálculo.',
  'The takeoff\'s name.':
    'El nombre del cálculo.',
  'in or mm: the unit it is read and printed in (blank: each user\'s own).':
    'in o mm: la unidad en que se lee e imprime (en blanco: la de cada usuario).',
  'How many walls.':
    'Cuántos muros.',
  'How many loose lines.':
    'Cuántas líneas sueltas.',
  'The made-to-order shower base\'s footprint width (blank: no base).':
    'El ancho de la huella de la base de ducha hecha a pedido (en blanco: sin base).',
  'Its footprint depth.':
    'La profundidad de su huella.',
  'Radius of a curved curb (blank: straight).':
    'Radio de un bordillo curvo (en blanco: recto).',
  'The curved curb\'s arc.':
    'El arco del bordillo curvo.',
  'Drain centre from the back-left corner, across.':
    'Centro del desagüe desde la esquina posterior izquierda, a lo ancho.',
  'Drain centre from the back-left corner, in depth.':
    'Centro del desagüe desde la esquina posterior izquierda, en profundidad.',
  'left, right or center.':
    'left, right o center (izquierda, derecha o centro).',
  'yes: no curb.':
    'yes: sin bordillo.',
  'A note on the base.':
    'Una nota sobre la base.',
  'Who entered it.':
    'Quién lo registró.',
  'UTC.':
    'Hora UTC.',
  'Each wall of each takeoff, in millimetres. Glass block walls carry their own weight only: size limits, anchoring and wet-area details follow the local building code and the block maker\'s instructions.':
    'Cada muro de cada cálculo, en milímetros. Los muros de bloque de vidrio solo soportan su propio peso: los límites de tamaño, el anclaje y los detalles de zonas húmedas siguen el código de construcción local y las instrucciones del fabricante de los bloques.',
  'The takeoff (takeoffs.xlsx).':
    'El cálculo (takeoffs.xlsx).',
  'The wall\'s place in the takeoff.':
    'El lugar del muro en el cálculo.',
  'The wall\'s name.':
    'El nombre del muro.',
  'opening (from the rough opening) or count (blocks across and courses).':
    'opening (desde el vano en bruto) o count (bloques a lo ancho e hiladas).',
  'Rough opening height (sized by opening).':
    'Altura del vano en bruto (dimensionado por vano).',
  'Courses high (sized by count).':
    'Hiladas de alto (dimensionado por cantidad).',
  'The block\'s nominal size as the trade says it.':
    'El tamaño nominal del bloque tal como lo dice el oficio.',
  'Actual face width.':
    'Ancho real de la cara.',
  'Actual face height.':
    'Alto real de la cara.',
  'Actual thickness.':
    'Espesor real.',
  'standard or thin.':
    'standard o thin (estándar o delgado).',
  'One block\'s weight.':
    'El peso de un bloque.',
  'yes: rectangular units set on end.':
    'yes: unidades rectangulares colocadas de canto.',
  'spacer (mortarless) or mortar.':
    'spacer (sin mortero) o mortar (mortero).',
  'Head and bed joint width.':
    'Ancho de las juntas verticales y horizontales.',
  'interior or exterior.':
    'interior o exterior.',
  'yes: a shower or other wet area.':
    'yes: una ducha u otra zona húmeda.',
  'Design wind pressure, pounds per square foot (exterior walls).':
    'Presión de viento de diseño, libras por pie cuadrado (muros exteriores).',
  'yes: the wall\'s start is an exposed end.':
    'yes: el inicio del muro es un extremo expuesto.',
  'yes: its end is an exposed end.':
    'yes: su final es un extremo expuesto.',
  'yes: no head to fix the top to.':
    'yes: no hay cabecera a la que fijar la parte superior.',
  'The wall\'s straight runs, curves and corners in order, as JSON (lengths in mm, angles in degrees).':
    'Los tramos rectos, curvas y esquinas del muro en orden, como JSON (longitudes en mm, ángulos en grados).',
  'Items chosen for this wall instead of the usual ones, as JSON (blank: none).':
    'Artículos elegidos para este muro en lugar de los habituales, como JSON (en blanco: ninguno).',
  'Items added to a takeoff by hand, outside any wall.':
    'Artículos agregados a mano a un cálculo, fuera de cualquier muro.',
  'The takeoff.':
    'El cálculo.',
  'How many.':
    'Cuántos.',
  'The unit counted in.':
    'La unidad en que se cuenta.',
  'A note.':
    'Una nota.',
  'Bills of materials made from takeoffs, every revision kept.':
    'Listas de materiales hechas a partir de cálculos, con todas sus revisiones.',
  'The bill\'s number.':
    'El número de la lista.',
  'The takeoff it was made from (blank: entered by hand).':
    'El cálculo del que se hizo (en blanco: registrada a mano).',
  'The job.':
    'La obra.',
  'Blocks the walls take.':
    'Bloques que llevan los muros.',
  'Blocks on the bill, with the waste allowance.':
    'Bloques en la lista, con el margen de desperdicio.',
  'Weight of the blocks.':
    'Peso de los bloques.',
  'Who made it.':
    'Quién la hizo.',
  'Every line of every bill revision.':
    'Todas las líneas de todas las revisiones de las listas.',
  'The bill (bills.xlsx).':
    'La lista (bills.xlsx).',
  'The bill\'s revision.':
    'La revisión de la lista.',
  'What the material does in the wall (block, spacer, sealant…).':
    'Qué hace el material en el muro (bloque, separador, sellador…).',
  'yes: built for this job (a shower base, a section).':
    'yes: hecho para esta obra (una base de ducha, una sección).',
  'How many have been picked.':
    'Cuántos se han preparado.',
  'How many have been ordered from a vendor.':
    'Cuántos se han pedido a un proveedor.',
  'The size and shape of a made-to-order item, as JSON.':
    'El tamaño y la forma de un artículo hecho a pedido, como JSON.',
  'The cautions each bill carried (structural limits, wet areas, heavy sections). They defer to the local building code and licensed practice.':
    'Las advertencias de cada lista (límites estructurales, zonas húmedas, secciones pesadas). Remiten al código de construcción local y a la práctica profesional autorizada.',
  'The bill.':
    'La lista.',
  'Its place on the bill.':
    'Su lugar en la lista.',
  'How serious.':
    'Qué tan grave es.',
  'The code section or rule it comes from.':
    'La sección del código o la regla de la que viene.',
  'The wall it is about (blank: the whole bill).':
    'El muro al que se refiere (en blanco: toda la lista).',
  'The caution as shown.':
    'La advertencia tal como se muestra.',
  'Quotes the contractor took, with what is held, picked and paid.':
    'Cotizaciones que el contratista aceptó, con lo reservado, preparado y pagado.',
  'The sales order\'s number.':
    'El número del pedido de venta.',
  'The quote it came from.':
    'La cotización de la que vino.',
  'Deposit asked on made-to-order lines.':
    'Anticipo pedido en las líneas hechas a pedido.',
  'Deposit to take before ordering.':
    'Anticipo que cobrar antes de pedir.',
  'Paid towards it.':
    'Pagado a cuenta.',
  'When everything stocked was picked (UTC).':
    'Cuándo se preparó todo lo que hay en existencia (UTC).',
  'When every line was handed over or cancelled (UTC).':
    'Cuándo cada línea se entregó o se canceló (UTC).',
  'Why it was cancelled.':
    'Por qué se canceló.',
  'Who booked it.':
    'Quién lo registró.',
  'Every line of every sales order.':
    'Todas las líneas de todos los pedidos de venta.',
  'The sales order.':
    'El pedido de venta.',
  'Stock units sold.':
    'Unidades de existencia vendidas.',
  'Tax on the line.':
    'Impuesto de la línea.',
  'yes: ordered from a vendor for this job.':
    'yes: pedido a un proveedor para esta obra.',
  'Stock units held for it.':
    'Unidades de existencia reservadas para él.',
  'Picked.':
    'Preparado.',
  'Left the counter or the truck.':
    'Salió por el mostrador o en el camión.',
  'Short when picked, waiting for stock.':
    'Faltante al preparar, en espera de existencias.',
  'No longer to be supplied.':
    'Ya no se va a surtir.',
  'Brought back.':
    'Devuelto.',
  'The vendor order raised for a made-to-order line.':
    'La orden al proveedor generada para una línea hecha a pedido.',
  'Money taken against sales orders. No card numbers or card details are kept by Lumenyard: card payments carry only the payment provider\'s own reference ids.':
    'Dinero cobrado contra pedidos de venta. Lumenyard no guarda números ni datos de tarjetas: los pagos con tarjeta llevan solo las referencias propias del proveedor de pagos.',
  'cash, cheque or card.':
    'cash, cheque o card (efectivo, cheque o tarjeta).',
  'The amount taken.':
    'El monto cobrado.',
  'pending, settled, failed or refunded.':
    'pending, settled, failed o refunded (pendiente, liquidado, fallido o reembolsado).',
  'Given back so far.':
    'Devuelto hasta ahora.',
  'The cheque number, or the provider\'s payment id.':
    'El número del cheque, o el identificador del pago del proveedor.',
  'The provider\'s id of the event that recorded it (card).':
    'El identificador del proveedor del evento que lo registró (tarjeta).',
  'Who recorded it.':
    'Quién lo registró.',
  'What left over the counter or on the truck against sales orders, one row per ticket line, with who signed for it. The signature images stay in Lumenyard (printed on each ticket\'s PDF).':
    'Lo que salió por el mostrador o en el camión contra pedidos de venta, una fila por línea de vale, con quién firmó. Las imágenes de las firmas se quedan en Lumenyard (impresas en el PDF de cada vale).',
  'The handover ticket\'s number.':
    'El número del vale de entrega.',
  'pickup or delivery.':
    'pickup o delivery (retiro o entrega).',
  'Where the ticket stands.':
    'En qué estado está el vale.',
  'The delivery address.':
    'La dirección de entrega.',
  'The name of who signed for it.':
    'El nombre de quien firmó.',
  'Taken from.':
    'Tomado de.',
  'Stock units handed over.':
    'Unidades de existencia entregadas.',
  'Goods brought back against sales orders, one row per returned line, with how the return was settled.':
    'Mercancía devuelta contra pedidos de venta, una fila por línea devuelta, con cómo se liquidó la devolución.',
  'The return\'s number.':
    'El número de la devolución.',
  'Whose.':
    'De quién.',
  'credit, cash, cheque or card.':
    'credit, cash, cheque o card (crédito, efectivo, cheque o tarjeta).',
  'The cheque number or the payment provider\'s refund id.':
    'El número del cheque o el identificador del reembolso del proveedor de pagos.',
  'Percent kept for restocking.':
    'Porcentaje retenido por reposición.',
  'Kept for restocking (whole return).':
    'Retenido por reposición (toda la devolución).',
  'Given back (whole return).':
    'Devuelto (toda la devolución).',
  'Stock units back.':
    'Unidades de existencia devueltas.',
  'Value of the line\'s goods.':
    'Valor de la mercancía de la línea.',
  'Where it was put back.':
    'Dónde se volvió a guardar.',
  'Who took it back.':
    'Quién la recibió de vuelta.',
  'Credit held for contractors (from returns settled as credit, or given by hand).':
    'Crédito a favor de los contratistas (de devoluciones liquidadas como crédito, o dado a mano).',
  'Credit given (positive) or used (negative).':
    'Crédito dado (positivo) o usado (negativo).',
  'The return it came from.':
    'La devolución de la que vino.',
  'Who.':
    'Quién.',
  'Stock sent between warehouses, one row per line.':
    'Existencias enviadas entre almacenes, una fila por línea.',
  'The transfer\'s number.':
    'El número del traslado.',
  'The sending warehouse.':
    'El almacén que envía.',
  'The receiving warehouse.':
    'El almacén que recibe.',
  'in_transit, received or cancelled.':
    'in_transit, received o cancelled (en tránsito, recibido o cancelado).',
  'Where it was taken from.':
    'De dónde se tomó.',
  'Stock units sent.':
    'Unidades de existencia enviadas.',
  'Stock units put away at the other end.':
    'Unidades de existencia guardadas en el otro extremo.',
  'Pick lists and their lines: what was to be taken from which bin and lot, and what was taken.':
    'Listas de preparación y sus líneas: qué había que tomar de qué ubicación y lote, y qué se tomó.',
  'The pick list\'s number.':
    'El número de la lista de preparación.',
  'The bill it picks (bills.xlsx), when it picks a bill.':
    'La lista de materiales que prepara (bills.xlsx), cuando prepara una.',
  'The sales order it picks, when it picks one.':
    'El pedido de venta que prepara, cuando prepara uno.',
  'Where.':
    'Dónde.',
  'draft, released, picking, picked or cancelled.':
    'draft, released, picking, picked o cancelled (borrador, liberada, en preparación, preparada o cancelada).',
  'The item it stands in for, when substituted.':
    'El artículo al que sustituye, cuando hay sustitución.',
  'Where to take it from.':
    'De dónde tomarlo.',
  'To pick.':
    'Por preparar.',
  'Picked and confirmed.':
    'Preparado y confirmado.',
  'Not found.':
    'No encontrado.',
  'Taken out of stock.':
    'Sacado de existencias.',
  'Cycle counts, one row per counted bin, item and lot, with what was expected, what was found and the difference.':
    'Conteos cíclicos, una fila por ubicación, artículo y lote contados, con lo esperado, lo encontrado y la diferencia.',
  'The count\'s number.':
    'El número del conteo.',
  'open, closed or cancelled.':
    'open, closed o cancelled (abierto, cerrado o cancelado).',
  'The bin.':
    'La ubicación.',
  '1, or more for a recount.':
    '1, o más para un reconteo.',
  'waiting, counted, matched, approved, recounted or cancelled.':
    'waiting, counted, matched, approved, recounted o cancelled (en espera, contado, coincide, aprobado, recontado o cancelado).',
  'What the books said.':
    'Lo que decían los libros.',
  'What was found.':
    'Lo que se encontró.',
  'Counted less expected.':
    'Contado menos esperado.',
  'Cost of one stock unit for the difference.':
    'Costo de una unidad de existencia para la diferencia.',
  'Who counted.':
    'Quién contó.',
  'The reviewer\'s note.':
    'La nota de quien revisó.',
  'Stock held in a bin for an order or pick list and not yet taken.':
    'Existencias reservadas en una ubicación para un pedido o una lista de preparación y aún no tomadas.',
  'Stock units held.':
    'Unidades de existencia reservadas.',
  'What holds it.':
    'Qué las reserva.',
  'How reorder points are worked out: the whole business\'s settings, then by family, by ABC class and by item and warehouse.':
    'Cómo se calculan los puntos de reorden: los ajustes de todo el negocio, luego por familia, por clase ABC y por artículo y almacén.',
  'global, family, abc or item_warehouse.':
    'global, family, abc o item_warehouse (todo el negocio, familia, clase ABC o artículo en un almacén).',
  'For a family.':
    'Para una familia.',
  'For an ABC class.':
    'Para una clase ABC.',
  'For one item…':
    'Para un artículo…',
  '…in one warehouse.':
    '…en un almacén.',
  'Chance of not running out during a lead time.':
    'Probabilidad de no quedarse sin existencias durante un plazo de entrega.',
  'Days between reviews.':
    'Días entre revisiones.',
  'Cost of placing one order.':
    'Costo de hacer un pedido.',
  'Yearly cost of holding stock, as a share of its value.':
    'Costo anual de mantener existencias, como fracción de su valor.',
  'How the order quantity is chosen.':
    'Cómo se elige la cantidad a pedir.',
  'Days ahead counted as soon.':
    'Días por delante que cuentan como pronto.',
  'Days of stock beyond which it is too much.':
    'Días de existencia a partir de los cuales sobra.',
  'Days without use before stock counts as dead.':
    'Días sin uso antes de que las existencias cuenten como sin movimiento.',
  'Days of use the statistics read.':
    'Días de consumo que leen las estadísticas.',
  'Share of usage value in class A.':
    'Fracción del valor de consumo en la clase A.',
  'Share up to the end of class B.':
    'Fracción hasta el final de la clase B.',
  'A reorder point typed in.':
    'Un punto de reorden escrito a mano.',
  'An order quantity typed in.':
    'Una cantidad a pedir escrita a mano.',
  'The reason given.':
    'El motivo dado.',
  'Each lead time seen: a vendor, an item, the order it came on and the days from sending the order to the first arrival of the item (from receipts here, and any brought in from before), in the columns of the lead times import. Reorder points read their mean and spread.':
    'Cada plazo de entrega observado: un proveedor, un artículo, la orden en que vino y los días desde el envío de la orden hasta la primera llegada del artículo (de las recepciones de aquí y de los traídos de antes), en las columnas de la importación de plazos de entrega. Los puntos de reorden leen su media y su dispersión.',
  'The purchase order.':
    'La orden de compra.',
  'Days from sending the order to the first receipt of the item (to the second).':
    'Días desde el envío de la orden hasta la primera recepción del artículo (al segundo).',
  'Suggested purchases and what became of them.':
    'Compras sugeridas y qué fue de ellas.',
  'For which warehouse.':
    'Para qué almacén.',
  'From whom.':
    'De quién.',
  'Stock units suggested.':
    'Unidades de existencia sugeridas.',
  'What raised it.':
    'Qué la generó.',
  'The order it went onto.':
    'La orden a la que pasó.',
  'Selling prices by price level and item, with quantity breaks.':
    'Precios de venta por nivel de precios y artículo, con descuentos por cantidad.',
  'The level (blank: every account).':
    'El nivel (en blanco: todas las cuentas).',
  'The rule applies from this many stock units.':
    'La regla se aplica desde esta cantidad de unidades de existencia.',
  'How the price is set.':
    'Cómo se fija el precio.',
  'Percent off list.':
    'Porcentaje de descuento sobre la lista.',
  'The sales tax rate charged at each warehouse, in the columns of the sales tax rates import.':
    'La tasa de impuesto sobre las ventas que se cobra en cada almacén, en las columnas de la importación de tasas de impuesto.',
  'Which item fills each material role of a takeoff, the waste allowance of each family, and the material rules (as JSON).':
    'Qué artículo cubre cada función de material de un cálculo, el margen de desperdicio de cada familia y las reglas de material (como JSON).',
  'role, waste or rule.':
    'role, waste o rule (función, desperdicio o regla).',
  'The material role, the family or the rule\'s key.':
    'La función del material, la familia o la clave de la regla.',
  'spacer or mortar (roles that differ by joint).':
    'spacer o mortar (funciones que cambian según la junta).',
  'The block the choice is for (blank: any).':
    'El bloque para el que es la elección (en blanco: cualquiera).',
  'The item chosen.':
    'El artículo elegido.',
  'Waste percent, piece length or yield, or the rule as JSON.':
    'Porcentaje de desperdicio, longitud de pieza o rendimiento, o la regla como JSON.',
  'no: the rule is off.':
    'no: la regla está desactivada.',
  'Every file brought in through the imports: who, when, the file, its rows and checksum, and whether it was reversed.':
    'Cada archivo traído por las importaciones: quién, cuándo, el archivo, sus filas y su suma de control, y si se revirtió.',
  'The import\'s number.':
    'El número de la importación.',
  'Which import.':
    'Qué importación.',
  'The file\'s name.':
    'El nombre del archivo.',
  'SHA-256 of the file.':
    'SHA-256 del archivo.',
  'Rows written.':
    'Filas escritas.',
  'When it was reversed (UTC).':
    'Cuándo se revirtió (UTC).',
  'Mail Lumenyard sent or is about to send (purchase orders, quotes). Attachments are not included: they are printed again from their orders.':
    'Correo que Lumenyard envió o está por enviar (órdenes de compra, cotizaciones). Los adjuntos no se incluyen: se vuelven a imprimir desde sus órdenes.',
  'Sender.':
    'Remitente.',
  'Recipient.':
    'Destinatario.',
  'Copies.':
    'Copias.',
  'Subject.':
    'Asunto.',
  'The message.':
    'El mensaje.',
  'The order it carried.':
    'La orden que llevaba.',
  'The quote it carried.':
    'La cotización que llevaba.',
  'Why it failed.':
    'Por qué falló.',
  'Who did what and when, oldest first.':
    'Quién hizo qué y cuándo, del más antiguo al más reciente.',
  'What.':
    'Qué.',
  'What kind of record.':
    'Qué tipo de registro.',
  'Which one.':
    'Cuál.',
  'The details, as JSON.':
    'Los detalles, como JSON.',
  'People who sign in, with their roles. No passwords or sign-in sessions are ever exported.':
    'Las personas que inician sesión, con sus funciones. Nunca se exportan contraseñas ni sesiones.',
  'What they sign in with.':
    'Con qué inician sesión.',
  'Their name as shown.':
    'Su nombre tal como se muestra.',
  'What they may do.':
    'Lo que pueden hacer.',
  'One or more of admin, counter, warehouse, buyer, viewer, separated by commas.':
    'Uno o más de admin, counter, warehouse, buyer, viewer, separados por comas.',
  'no: can no longer sign in.':
    'no: ya no puede iniciar sesión.',
  'Lengths shown in inches or millimetres.':
    'Longitudes mostradas en pulgadas o milímetros.',
  'Weights shown in pounds or kilograms.':
    'Pesos mostrados en libras o kilogramos.',
  'The language of their screens and documents.':
    'El idioma de sus pantallas y documentos.',
  'The company profile every document carries, and the administrator\'s settings.':
    'El perfil de la empresa que lleva cada documento, y los ajustes del administrador.',
  'Its value.':
    'Su valor.',
  'sign-in sessions: secrets, and meaningless anywhere else':
    'sesiones iniciadas: secretas, y sin sentido en cualquier otro lugar',
  'counts of failed sign-ins, kept a few minutes':
    'conteos de inicios de sesión fallidos, guardados unos minutos',
  'answers kept briefly so a request sent twice is done once':
    'respuestas guardadas un rato para que una solicitud enviada dos veces se haga una sola vez',
  'how far each everything-out download got, and where its file waits; kept half an hour':
    'hasta dónde llegó cada descarga de todos los datos y dónde espera su archivo; se guarda media hora',
  'how far each import check got, and its answer; kept half an hour for the page that lost it':
    'hasta dónde llegó cada revisión de una importación, y su respuesta; se guarda media hora para la página que la perdió',
  'each problem row of an import check, paged to the person who ran it; gone with its run':
    'cada fila con problemas de la revisión de una importación, por páginas para quien la hizo; se va con su revisión',
  'uploads waiting for their commit and everything-out files, kept a short while for any app process to serve':
    'archivos subidos que esperan su importación y archivos de todos los datos, guardados un rato para que cualquier proceso de la app los sirva',
  'the pieces of those files':
    'los trozos de esos archivos',
  'the next purchase order number; follows from purchase-orders.xlsx':
    'el siguiente número de orden de compra; se deduce de purchase-orders.xlsx',
  'what each scanner last reported as waiting to send; device state, not records':
    'lo último que cada escáner informó como pendiente de enviar; estado del dispositivo, no registros',
  'average costs kept only so an import can be reversed in this database':
    'costos promedio guardados solo para poder revertir una importación en esta base de datos',
  'averages and minimums before an import, kept only so it can be reversed in this database':
    'costos promedio y mínimos de antes de una importación, guardados solo para poder revertirla en esta base de datos',
  'An item already in the catalog.':
    'Un artículo que ya está en el catálogo.',
  'the takeoff as it stood when each bill revision was made; its result is in bill-lines.xlsx':
    'el cálculo tal como estaba al hacerse cada revisión de la lista; su resultado está en bill-lines.xlsx',
  'the items a count was limited to; the counted lines are in counts.xlsx':
    'los artículos a los que se limitó un conteo; las líneas contadas están en counts.xlsx',
  'progress through each bin of a count; the counted lines are in counts.xlsx':
    'el avance por cada ubicación de un conteo; las líneas contadas están en counts.xlsx',
  'each scan while picking; what was picked is in pick-lists.xlsx and moves.xlsx':
    'cada escaneo al preparar; lo preparado está en pick-lists.xlsx y moves.xlsx',
  'what was done about each short line while picking; the outcome is in pick-lists.xlsx':
    'lo que se hizo con cada línea faltante al preparar; el resultado está en pick-lists.xlsx',
  'transfers proposed while picking; those made are in transfers.xlsx':
    'traslados propuestos al preparar; los hechos están en transfers.xlsx',
  'the card-payment provider\'s messages as received; each payment with its provider ids is in payments.xlsx':
    'los mensajes del proveedor de pagos con tarjeta tal como llegaron; cada pago con sus identificadores del proveedor está en payments.xlsx',
  'the PDF and spreadsheet files mailed; they print again from their orders':
    'los archivos PDF y de hoja de cálculo enviados por correo; se vuelven a imprimir desde sus órdenes',
  'the database layout\'s version':
    'la versión de la estructura de la base de datos',
  // What the import templates' guide sheets say a column takes, beyond what the README already says.
  'A whole month, as YYYY-MM, when you only know monthly totals: the quantity is spread over its days in whole units. Only months already over.':
    'Un mes entero, como AAAA-MM, cuando solo conoce los totales mensuales: la cantidad se reparte entre sus días en unidades enteras. Solo meses ya terminados.',
  'Your code for the warehouse: 2 to 12 capital letters or digits. A code already in Lumenyard is refused.':
    'Su código para el almacén: de 2 a 12 letras mayúsculas o dígitos. Un código que ya está en Lumenyard se rechaza.',
  'Its name, as documents show it.':
    'Su nombre, tal como lo muestran los documentos.',
  'Where it is (optional).':
    'Dónde está (opcional).',
  'How its storage bin codes are made, as a pattern naming aisle, bay and level (blank: A-01-1 style).':
    'Cómo se forman los códigos de sus ubicaciones de almacenaje, como un patrón que nombra pasillo, módulo y nivel (en blanco: estilo A-01-1).',
  'no for a warehouse no longer in use (blank: yes).':
    'no para un almacén que ya no se usa (en blanco: yes).',
  'The code of a warehouse already in Lumenyard (import warehouses first).':
    'El código de un almacén que ya está en Lumenyard (importe antes los almacenes).',
  'The bin code, unique in its warehouse. A storage bin must fit the warehouse\'s bin pattern.':
    'El código de la ubicación, único en su almacén. Una ubicación de almacenaje debe ajustarse al patrón de ubicaciones del almacén.',
  'storage, receiving or staging (blank: storage). Transit rows are skipped: transfers make their own.':
    'storage, receiving o staging (almacenaje, recepción o preparación; en blanco: storage). Las filas transit se omiten: los traslados crean las suyas.',
  'no for a bin no longer in use (blank: yes).':
    'no para una ubicación que ya no se usa (en blanco: yes).',
  'Your code for the level: 2 to 20 letters, digits or dashes. A code already in Lumenyard is refused.':
    'Su código para el nivel: de 2 a 20 letras, dígitos o guiones. Un código que ya está en Lumenyard se rechaza.',
  'Percent off list price for accounts on this level, 0 to 100 with up to 2 decimals (blank: only its own rules).':
    'Porcentaje de descuento sobre el precio de lista para las cuentas de este nivel, de 0 a 100 con hasta 2 decimales (en blanco: solo sus propias reglas).',
  'no for a level no longer offered (blank: yes).':
    'no para un nivel que ya no se ofrece (en blanco: yes).',
  'A price level code already in Lumenyard (blank: the rule holds for every account).':
    'Un código de nivel de precios que ya está en Lumenyard (en blanco: la regla vale para todas las cuentas).',
  'The rule holds from this many stock units (or packs) on (blank: 1). Several rows for one item make quantity breaks.':
    'La regla vale desde esta cantidad de unidades de existencia (o empaques) en adelante (en blanco: 1). Varias filas para un artículo forman descuentos por cantidad.',
  'unit for a price per stock unit, pack for a price per case (blank: unit).':
    'unit para un precio por unidad de existencia, pack para un precio por caja (en blanco: unit).',
  'The price, up to 2 decimals, no currency sign. Give a price or a percent off, not both.':
    'El precio, hasta 2 decimales, sin signo de moneda. Indique un precio o un porcentaje de descuento, no ambos.',
  'Percent off list price, 0 to 100.':
    'Porcentaje de descuento sobre el precio de lista, de 0 a 100.',
  'Your code for the vendor (letters, digits, . _ -; up to 20). A code already in Lumenyard is refused.':
    'Su código para el proveedor (letras, dígitos, . _ -; hasta 20). Un código que ya está en Lumenyard se rechaza.',
  'The vendor\'s name as it goes on purchase orders.':
    'El nombre del proveedor tal como va en las órdenes de compra.',
  'Who takes your orders.':
    'Quién toma sus pedidos.',
  'Where purchase orders are sent.':
    'Adónde se envían las órdenes de compra.',
  'Payment terms as you agreed them, e.g. 30 days net (up to 40 characters).':
    'Condiciones de pago tal como las acordó, p. ej. 30 días netos (hasta 40 caracteres).',
  'The ISO 4217 code of the currency you pay in, e.g. USD (blank: USD).':
    'El código ISO 4217 de la moneda en que paga, p. ej. USD (en blanco: USD).',
  'Usual days from order to arrival, 0 to 365 (blank: 14). An item\'s own lead time goes in the vendor items file.':
    'Días habituales desde el pedido hasta la llegada, de 0 a 365 (en blanco: 14). El plazo de entrega propio de un artículo va en el archivo de artículos de proveedores.',
  'no for a vendor you no longer buy from (blank: yes).':
    'no para un proveedor al que ya no compra (en blanco: yes).',
  'A vendor already in Lumenyard.':
    'Un proveedor que ya está en Lumenyard.',
  'The purchase order it came on (up to 40 characters); one row per vendor, item and order.':
    'La orden de compra en que vino (hasta 40 caracteres); una fila por proveedor, artículo y orden.',
  'Days from sending the order to the first arrival of the item, 0 to 3650 (fractions of a day allowed).':
    'Días desde el envío de la orden hasta la primera llegada del artículo, de 0 a 3650 (se admiten fracciones de día).',
  'A warehouse code, as set up under Warehouses. One row per item and warehouse.':
    'Un código de almacén, tal como está en Almacenes. Una fila por artículo y almacén.',
  'The moving-average cost of one stock unit there, 0 or more, up to 4 decimals. Where the warehouse holds the item, bring its stock in first: the cost must then be the one its stock carries.':
    'El costo promedio móvil de una unidad de existencia ahí, 0 o más, hasta 4 decimales. Donde el almacén tiene el artículo, importe antes su existencia: el costo debe ser entonces el que lleva esa existencia.',
  'The minimum set by hand (below it the stock screens flag the item), a whole number 0 or more; blank: none.':
    'El mínimo fijado a mano (por debajo, las pantallas de existencia marcan el artículo), un número entero de 0 o más; en blanco: ninguno.',
  'The code of a warehouse already in Lumenyard: sales from it are taxed at this rate. One row per warehouse.':
    'El código de un almacén que ya está en Lumenyard: sus ventas pagan impuesto a esta tasa. Una fila por almacén.',
  'The rate in percent, 0 to 30 with up to 4 decimals (8.25 for 8.25 %). A warehouse that already charges a rate is refused: change it under Selling prices → Sales tax by location.':
    'La tasa en porcentaje, de 0 a 30 con hasta 4 decimales (8.25 para 8.25 %). Un almacén que ya cobra una tasa se rechaza: cámbiela en Precios de venta → Impuesto por sede.',
  'How documents name the tax, up to 80 characters (optional).':
    'Cómo nombran el impuesto los documentos, hasta 80 caracteres (opcional).',
  'global (the whole business), family, abc (an ABC class) or item_warehouse (one item in one warehouse). One row per target; a target already set in Lumenyard is refused.':
    'global (todo el negocio), family (una familia), abc (una clase ABC) o item_warehouse (un artículo en un almacén). Una fila por destino; un destino ya fijado en Lumenyard se rechaza.',
  'For family rows: glass_block, spacer, arc_spacer, sealant, grout, anchor, fastener, shower_base, wall_section, accessory.':
    'Para las filas family: glass_block, spacer, arc_spacer, sealant, grout, anchor, fastener, shower_base, wall_section, accessory.',
  'For abc rows: A, B or C.':
    'Para las filas abc: A, B o C.',
  'For item_warehouse rows: the item.':
    'Para las filas item_warehouse: el artículo.',
  'For item_warehouse rows: the warehouse code.':
    'Para las filas item_warehouse: el código del almacén.',
  'The chance of not running out during a lead time, 0.5 to 0.999 (blank: taken from the layer above).':
    'La probabilidad de no quedarse sin existencias durante un plazo de entrega, de 0.5 a 0.999 (en blanco: la de la capa superior).',
  'Days between reviews, 1 to 365.':
    'Días entre revisiones, de 1 a 365.',
  'What placing one order costs, up to 2 decimals.':
    'Lo que cuesta hacer un pedido, hasta 2 decimales.',
  'Yearly cost of holding stock as a share of its value, 0 to 2 (0.25 = 25 %).':
    'Costo anual de mantener existencias como fracción de su valor, de 0 a 2 (0.25 = 25 %).',
  'eoq (economic order quantity) or orderUpTo (order up to a level).':
    'eoq (cantidad económica de pedido) u orderUpTo (pedir hasta un nivel).',
  'global rows only: days of use the statistics read.':
    'Solo filas global: días de consumo que leen las estadísticas.',
  'global rows only: the share of usage value that ends class A, 0 to 1.':
    'Solo filas global: la fracción del valor de consumo con que termina la clase A, de 0 a 1.',
  'global rows only: the share that ends class B.':
    'Solo filas global: la fracción con que termina la clase B.',
  'item_warehouse rows only: a reorder point typed in (give the reason).':
    'Solo filas item_warehouse: un punto de reorden escrito a mano (indique el motivo).',
  'item_warehouse rows only: an order quantity typed in (give the reason).':
    'Solo filas item_warehouse: una cantidad a pedir escrita a mano (indique el motivo).',
  'Why a figure is set by hand.':
    'Por qué una cifra se fija a mano.',
}
