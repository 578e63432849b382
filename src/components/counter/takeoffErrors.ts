/** The field errors under one path prefix, with the prefix taken off ("walls.0." → "heightMm"). */
export function scopedErrors(errors: Record<string, string>, prefix: string): Record<string, string> {
  const out: Record<string, string> = {}
  for (const [key, message] of Object.entries(errors)) if (key.startsWith(prefix)) out[key.slice(prefix.length)] = message
  return out
}
