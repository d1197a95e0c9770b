/**
 * Spreadsheet formula injection (OWASP "CSV Injection"): a cell that begins with =, +, -, @, a tab or a carriage
 * return may be run as a formula when the file is opened in a spreadsheet. Free-text cells that begin with one
 * of these get a leading apostrophe ('), which spreadsheets show as text; the original value is the cell
 * without that first apostrophe. Only free-text columns are neutralised (docs/api.md lists them per export):
 * numbers, ids, timestamps and the identifiers column (always `scheme:value`, so an E.164 phone "+4420…" stays
 * a phone) are written as they are.
 */
const TRIGGERS = new Set(['=', '+', '-', '@', '\t', '\r']);

export function neutralise(value: string | null | undefined): string {
  if (value === null || value === undefined) return '';
  return value.length > 0 && TRIGGERS.has(value[0]!) ? `'${value}` : value;
}

export function needsNeutralising(value: string): boolean {
  return value.length > 0 && TRIGGERS.has(value[0]!);
}
