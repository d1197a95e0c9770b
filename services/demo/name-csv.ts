/**
 * The CSV the scale generator writes: its header and one line per generated row.
 */
import type { GeneratedNameRow } from './generated-name-row.ts';

export const NAME_CSV_HEADER = 'entity_id,name,country,variant_kind,sibling_of';

/** One CSV line (RFC 4180 quoting) without the line break. */
export function nameCsvLine(row: GeneratedNameRow): string {
  return [row.entityId, row.name, row.country, row.variantKind, row.siblingOf ?? ''].map(csvField).join(',');
}

function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}
