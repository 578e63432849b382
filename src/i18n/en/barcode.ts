// Printed barcodes (labels, pick sheets, receiving).
export default {
  tooLong: 'Too long to print readably in this space: choose a larger label.',
}
