// A card deposit at the counter: the customer pays on the payment provider's own page (a link, or its QR code
// on their phone); Lumenyard never sees the card and follows the payment until the provider's signed word lands.
export default {
  title: 'Card deposit',
  intro: 'The customer enters the card on the payment provider\'s page, on their phone or the counter tablet. Lumenyard never sees the card.',
  amount: 'Amount to take now',
  amountHint: 'Up to {due}, the deposit still due.',
  start: 'Take card deposit',
  openPage: 'Open the payment page',
  scanHint: 'Or let the customer scan this code with their phone.',
  qrLabel: 'QR code of the payment page',
  stage: {
    waiting: 'Waiting for the customer to pay {amount} on the payment page…',
    declined: 'The card was declined. The customer can try another card on the same page, or cancel there.',
    settling: 'The provider took the card; waiting for its confirmation…',
    paid: 'Paid: {amount} by card is recorded on this order.',
    cancelled: 'The card payment of {amount} was cancelled; nothing was charged.',
    refunded: 'The card payment of {amount} was refunded.',
  },
  offline: 'The connection is lost, so the payment cannot be followed. The customer can still pay; check again when the connection is back.',
  checkAgain: 'Check again',
  cancel: 'Cancel this card payment',
  cancelAsk: 'Cancel the card payment of {amount}? The payment page stops taking the card; nothing has been charged.',
  keep: 'Keep waiting',
  startAgain: 'Take another card payment',
  noPage: 'This payment provider gives no page link here; ask the customer to pay from the provider\'s own app.',
}
