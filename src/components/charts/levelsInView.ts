// A value axis that always shows the levels drawn on it (reorder point, safety stock), not only the data:
// a level above the highest position or below zero would otherwise be cut off the chart.
export function levelsInView(extent: { min: number; max: number }, levels: readonly number[]): { min: number; max: number } {
  const low = Math.min(0, extent.min, ...levels)
  const high = Math.max(extent.max, ...levels)
  // A little room above the top line so its label stays inside the plot.
  const pad = (high - low) * 0.08 || 1
  return { min: low < 0 ? low - pad : low, max: high + pad }
}
