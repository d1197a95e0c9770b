/**
 * Legal forms for answers that carry a name but whose rows store none (mentions, the plain counterparty list):
 * the same analysis as resolution (services/register/matching/analysis.ts, cached), so the console shows what
 * the matcher compared instead of guessing.
 */
import { analyse } from '../../../register/matching/analysis.ts';

export interface LegalFormOut {
  /** The designator as written ("B.V.", "Ltd"). */
  text: string;
  /** The family the comparators use ("bv", "ltd"). */
  family: string;
}

/** The legal form analysed from a name, or null when it carries none. */
export function legalFormOfText(text: string): LegalFormOut | null {
  const form = analyse(text).legalForm;
  return form ? { text: form.text, family: form.family } : null;
}

/** The legal-form family of a name (the search answers this for its hits). */
export function legalFormFamily(name: string): string | null {
  return analyse(name).legalForm?.family ?? null;
}

/** A mention with `legalForm` analysed from its text. */
export function withLegalForm<T extends { text: string }>(mention: T): T & { legalForm: LegalFormOut | null } {
  return { ...mention, legalForm: legalFormOfText(mention.text) };
}
