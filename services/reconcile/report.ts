/** The reconciliation report as CSV: one row per finding; free-text cells neutralised against formula injection. */
import { stringify } from 'csv-stringify/sync';
import { neutralise } from '../export/neutralise.ts';
import type { Finding } from './reconcile.ts';

export const REPORT_COLUMNS = [
  'vendor_row_id',
  'vendor_name',
  'finding',
  'counterparty_id',
  'canonical_name',
  'contract_count',
  'evidence',
  'paired_vendor_row_id',
];

export function reportCsv(findings: Finding[]): string {
  return stringify([
    REPORT_COLUMNS,
    ...findings.map((f) => [
      neutralise(f.vendorRowId),
      neutralise(f.vendorName),
      f.finding,
      f.counterpartyId ?? '',
      neutralise(f.canonicalName),
      f.contractCount ?? '',
      neutralise(f.evidence),
      neutralise(f.pairedVendorRowId),
    ]),
  ]);
}
