/**
 * Whether two analysed names stand for the same entity inside one contract (preamble "Qorv Robotics, Inc."
 * and signature block "QORV ROBOTICS, INC."), or a party and one of our own entities. Strict on purpose:
 * equal normalised names, equal cores with the same (or an absent) legal form family or an ISO 20275 code in
 * common, or one name with its local
 * legal form and an English rendering of that form (sameWithTranslatedForm).
 */
import { sameWithTranslatedForm, type NameAnalysis } from '../analyse/index.ts';

export function sameEntityName(a: NameAnalysis, b: NameAnalysis): boolean {
  if (a.normalised.length === 0 || b.normalised.length === 0) return false;
  if (a.normalised === b.normalised) return true;
  // "Orvanel Japan Co., Ltd." and "Orvanel Japan K.K.": one entity, its form once in English, once in Japanese.
  if (sameWithTranslatedForm(a, b)) return true;
  if (a.core.length === 0 || a.core !== b.core) return false;
  const fa = a.legalForm?.family;
  const fb = b.legalForm?.family;
  if (fa === undefined || fb === undefined || fa === fb) return true;
  // "S.L." and "Sociedad de Responsabilidad Limitada", "AG" and "SA" in Switzerland: two spellings of one form,
  // as one ISO 20275 code among those each stands for says.
  const codes = new Set(a.legalForm?.elfCodes ?? []);
  return (b.legalForm?.elfCodes ?? []).some((c) => codes.has(c));
}
