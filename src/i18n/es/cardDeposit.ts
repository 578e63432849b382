// Anticipo con tarjeta en el mostrador (véase en/cardDeposit.ts).
export default {
  title: 'Anticipo con tarjeta',
  intro: 'El cliente introduce la tarjeta en la página del proveedor de pagos, en su teléfono o en la tableta del mostrador. Lumenyard nunca ve la tarjeta.',
  amount: 'Importe a cobrar ahora',
  amountHint: 'Hasta {due}, el anticipo pendiente.',
  start: 'Cobrar anticipo con tarjeta',
  openPage: 'Abrir la página de pago',
  scanHint: 'O deje que el cliente escanee este código con su teléfono.',
  qrLabel: 'Código QR de la página de pago',
  stage: {
    waiting: 'Esperando a que el cliente pague {amount} en la página de pago…',
    declined: 'La tarjeta fue rechazada. El cliente puede probar otra tarjeta en la misma página o cancelar allí.',
    settling: 'El proveedor aceptó la tarjeta; esperando su confirmación…',
    paid: 'Pagado: {amount} con tarjeta queda registrado en este pedido.',
    cancelled: 'El pago con tarjeta de {amount} se canceló; no se cobró nada.',
    refunded: 'El pago con tarjeta de {amount} se devolvió.',
  },
  offline: 'Se perdió la conexión, así que no se puede seguir el pago. El cliente puede pagar igualmente; compruébelo de nuevo cuando vuelva la conexión.',
  checkAgain: 'Comprobar de nuevo',
  startAgain: 'Cobrar otro pago con tarjeta',
  noPage: 'Este proveedor de pagos no da un enlace a su página aquí; pida al cliente que pague desde la aplicación del proveedor.',
}
