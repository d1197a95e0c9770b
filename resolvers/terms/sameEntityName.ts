/**
 * Whether two analysed names stand for the same entity inside one contract (preamble "Qorv Robotics, Inc."
 * and signature block "QORV ROBOTICS, INC."), or a party and one of our own entities. Strict on purpose:
 * equal normalised names, or equal cores with the same (or an absent) legal form family.
 */
import type { NameAnalysis } from '../analyse/types.ts';

export function sameEntityName(a: NameAnalysis, b: NameAnalysis): boolean {
  if (a.normalised.length === 0 || b.normalised.length === 0) return false;
  if (a.normalised === b.normalised) return true;
  if (a.core.length === 0 || a.core !== b.core) return false;
  const fa = a.legalForm?.family;
  const fb = b.legalForm?.family;
  return fa === undefined || fb === undefined || fa === fb;
}
