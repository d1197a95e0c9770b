/**
 * Corruptions that turn a clean organisation name into the variants people, ERPs, OCR and extraction
 * models produce. The kinds follow the corruption families of record-linkage test-data generators
 * (Christen & Pudjijono 2009: typographical, keyboard, OCR and phonetic errors; Tran, Vatsalan &
 * Christen 2013: attribute-level abbreviation, token drops and swaps, missing values), plus the
 * legal-form, punctuation and case variants that organisation names add. Each returns null when it does
 * not apply to the name (the caller then tries another kind), never the name unchanged. Each kind is written in
 * variants/; this module names them and applies one.
 */
import type { Random } from '../../resolvers/prng.ts';
import { renderName, type NameParts } from './render-name.ts';
import { caseVariant, legalFormVariant, punctuationVariant } from './variants/spelling-variants.ts';
import { keyboardTypo } from './variants/keyboard-typo.ts';
import { ocrError } from './variants/ocr-error.ts';
import { phoneticVariant } from './variants/phonetic-variant.ts';
import { abbreviationVariant } from './variants/abbreviation-variant.ts';
import { tokenDrop, tokenSwap, whitespaceVariant } from './variants/token-variants.ts';
import { foldDiacritics } from './variants/fold-diacritics.ts';

export const VARIANT_KINDS = [
  'legal_form',
  'punctuation',
  'case',
  'keyboard_typo',
  'ocr',
  'phonetic',
  'abbreviation',
  'token_drop',
  'token_swap',
  'whitespace',
  'diacritics',
] as const;
export type VariantKind = (typeof VARIANT_KINDS)[number];

type Corruption = (parts: NameParts, rnd: Random) => NameParts | null;

export const CORRUPTIONS: Readonly<Record<VariantKind, Corruption>> = {
  legal_form: legalFormVariant,
  punctuation: punctuationVariant,
  case: caseVariant,
  keyboard_typo: (p, r) => onBase(p, keyboardTypo(p.base, r)),
  ocr: (p, r) => onBase(p, ocrError(p.base, r)),
  phonetic: (p, r) => onBase(p, phoneticVariant(p.base, r)),
  abbreviation: abbreviationVariant,
  token_drop: tokenDrop,
  token_swap: tokenSwap,
  whitespace: (p, r) => onBase(p, whitespaceVariant(p.base, r)),
  diacritics: (p, r) => onBase(p, foldDiacritics(p.base, r)),
};

/** Applies one corruption; null when it does not apply or would change nothing. */
export function corrupt(kind: VariantKind, parts: NameParts, rnd: Random): NameParts | null {
  const out = CORRUPTIONS[kind](parts, rnd);
  if (!out || renderName(out) === renderName(parts) || out.base.trim() === '') return null;
  return out;
}

function onBase(parts: NameParts, base: string | null): NameParts | null {
  return base === null ? null : { ...parts, base };
}
