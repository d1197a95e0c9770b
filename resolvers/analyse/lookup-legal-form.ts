/**
 * Legal-form lookups for other stages (defined terms, the legal-form comparator, blocking):
 * - lookupLegalForm("Pty. Ltd.") → the designator's family and codes, or null when it is not a designator;
 * - legalFormFamily("Limited") → "ltd";
 * - findLegalForm("Qorv GmbH & Co. KG", { country: "DE" }) → the legal form found in a whole name.
 */
import type { AnalyseHints, LegalFormMatch } from './types.ts';
import { designatorKey } from './designator-key.ts';
import { legalFormIndex } from './legal-form-index.ts';
import { narrowCodes, validateCountry } from './narrow-codes.ts';
import { analyseName } from './analyse-name.ts';

export interface LegalFormInfo {
  key: string;
  family: string;
  elfCodes: string[];
  jurisdictions: string[];
}

export function lookupLegalForm(designator: string, hints: AnalyseHints = {}): LegalFormInfo | null {
  const entry = legalFormIndex().entries.get(designatorKey(designator));
  if (!entry) return null;
  const narrowed = narrowCodes(entry, validateCountry(hints.country));
  return { key: entry.key, family: entry.family, elfCodes: narrowed.codes, jurisdictions: narrowed.jurisdictions };
}

/** The family of a designator, or null when the text is not a known designator. */
export function legalFormFamily(designator: string): string | null {
  return legalFormIndex().entries.get(designatorKey(designator))?.family ?? null;
}

export function findLegalForm(name: string, hints: AnalyseHints = {}): LegalFormMatch | null {
  return analyseName(name, hints).legalForm;
}
