/**
 * A generated organisation name in two parts, the words before its legal form and the form, as the corruptions
 * change them (corrupt.ts), and the name they spell.
 */
import type { LegalFormFamily } from './name-parts.ts';

/** A name split into the words before its legal form and the form itself. */
export interface NameParts {
  base: string;
  form?: string;
  family?: LegalFormFamily;
  /** "Brackenridge Fabrication, Inc." rather than "Brackenridge Fabrication Inc." */
  comma?: boolean;
}

export function renderName(parts: NameParts): string {
  if (!parts.form) return parts.base;
  return `${parts.base}${parts.comma ? ', ' : ' '}${parts.form}`;
}
