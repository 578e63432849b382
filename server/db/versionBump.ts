/**
 * The assignment that moves a row to its next version in `INSERT … ON DUPLICATE KEY UPDATE` when the incoming values
 * change any of `columns`, so an edit screen opened before the write is refused (server/services/editVersion.ts)
 * while a row written again unchanged keeps its version. It must come first in the UPDATE list: MariaDB assigns
 * from left to right, so the comparison still sees the row's old values.
 */
export function versionBumpIfChanged(columns: readonly string[]): string {
  return `version = IF(${columns.map((c) => `${c} <=> VALUES(${c})`).join(' AND ')}, version, version + 1)`
}
