/**
 * Legal-form compatibility of two names, from the name analysis (resolvers/analyse/types.ts → LegalFormMatch).
 *
 * - same_family: the same designator family ("Ltd" and "Limited"; "L.L.C." and "LLC"), or two spellings of one ELF
 *   code (one side narrowed to a single code that the other can stand for).
 * - compatible: different families that can stand for the same legal form (their ISO 20275 ELF codes overlap,
 *   e.g. "AG" and "SA" of a Swiss company limited by shares).
 * - conflicting: different legal forms in the same jurisdiction (a GB "plc" is not a GB "Ltd"; US-DE vs US
 *   counts as the same jurisdiction): the names belong to different legal entities.
 * - different_jurisdiction: different legal forms with no jurisdiction in common ("plc" GB vs "GmbH" DE):
 *   different legal entities too, but often affiliates (a foreign subsidiary), hence a level of its own.
 * - missing: one side (or both) has no legal form.
 */
import type { LegalFormMatch } from '../analyse/index.ts';
import { jurisdictionsCompatible } from './jurisdiction.ts';

export type LegalFormLevel = 'same_family' | 'compatible' | 'conflicting' | 'different_jurisdiction' | 'missing';

export interface LegalFormComparison {
  level: LegalFormLevel;
  explanation: string;
}

function sameCodes(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((code) => b.includes(code));
}

function sharedJurisdiction(a: readonly string[], b: readonly string[]): string | null {
  for (const x of a) for (const y of b) if (jurisdictionsCompatible(x, y)) return x.length <= y.length ? x : y;
  return null;
}

export function compareLegalForms(a: LegalFormMatch | null, b: LegalFormMatch | null): LegalFormComparison {
  if (a === null || b === null) {
    const side = a === null && b === null ? 'neither name has' : a === null ? 'the first name has no' : 'the second name has no';
    return { level: 'missing', explanation: `${side} legal form${a === null && b === null ? '' : ` (other: ${(a ?? b)!.text})`}` };
  }
  if (a.family === b.family) return { level: 'same_family', explanation: `"${a.text}" and "${b.text}" are the same legal form (${a.family})` };
  const shared = a.elfCodes.find((code) => b.elfCodes.includes(code));
  // Two spellings of one ELF code ("S. Coop. de Crédito" / "S.C.C." in ES) are one legal form, not merely compatible.
  if (shared !== undefined && (a.elfCodes.length === 1 || b.elfCodes.length === 1 || sameCodes(a.elfCodes, b.elfCodes))) {
    return { level: 'same_family', explanation: `"${a.text}" and "${b.text}" are the same legal form (ELF ${shared})` };
  }
  if (shared !== undefined) {
    return { level: 'compatible', explanation: `"${a.text}" and "${b.text}" can both stand for ELF ${shared}` };
  }
  // No jurisdiction known on a side: we cannot tell where, and different forms still mean different entities.
  if (a.jurisdictions.length === 0 || b.jurisdictions.length === 0) {
    return { level: 'conflicting', explanation: `"${a.text}" and "${b.text}" are different legal forms` };
  }
  const where = sharedJurisdiction(a.jurisdictions, b.jurisdictions);
  if (where !== null) {
    return { level: 'conflicting', explanation: `"${a.text}" and "${b.text}" are different legal forms in ${where}` };
  }
  return {
    level: 'different_jurisdiction',
    explanation: `"${a.text}" (${a.jurisdictions.join(', ')}) and "${b.text}" (${b.jurisdictions.join(', ')}) are legal forms of different jurisdictions`,
  };
}
