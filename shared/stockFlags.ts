// Flags the stock screens and the server compute alike, kept apart from the answer schemas (shared/schemas/
// stockViews.ts re-exports them) so a screen that needs only the flag does not load the schema library with it.

/** The low-stock flag: a minimum is set and what can be promised has fallen below it. */
export function isLowStock(available: number, minQty: number | null): boolean {
  return minQty !== null && available < minQty
}
