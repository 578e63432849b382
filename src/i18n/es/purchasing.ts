// Spanish for what the warehouse's receiving screens borrow from purchasing; the rest falls back to English.
export default {
  number: 'Número',
  shipTo: 'Destino',
  status: 'Estado',
  sku: 'SKU',
  description: 'Descripción',
  statuses: {
    draft: 'Borrador',
    approved: 'Aprobada',
    sent: 'Enviada',
    partly_received: 'Recibida en parte',
    received: 'Recibida',
    closed: 'Cerrada',
    cancelled: 'Cancelada',
  },
}
