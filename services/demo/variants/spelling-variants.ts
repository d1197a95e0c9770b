/**
 * Corruptions that write the same name another way: another spelling of its legal form (or none), other punctuation,
 * other letter case.
 */
import type { Random } from '../../../resolvers/prng.ts';
import type { NameParts } from '../render-name.ts';

/** Another spelling of the same legal form, or no form at all (one time in four). */
export function legalFormVariant(parts: NameParts, rnd: Random): NameParts | null {
  if (!parts.form || !parts.family) return null;
  if (rnd.chance(0.25)) return { base: parts.base };
  const choices = [parts.family.canonical, ...parts.family.variants].filter((f) => f !== parts.form);
  if (choices.length === 0) return null;
  return { ...parts, form: rnd.pick(choices), comma: rnd.chance(0.3) };
}

export function punctuationVariant(parts: NameParts, rnd: Random): NameParts | null {
  const strip = (s: string): string => s.replaceAll('.', '').replaceAll(',', '');
  const roll = rnd.int(3);
  if (roll === 0 && parts.base.includes('&')) return { ...parts, base: parts.base.replaceAll('&', 'and') };
  if (roll === 1 && parts.base.includes(' and ')) return { ...parts, base: parts.base.replaceAll(' and ', ' & ') };
  if (roll === 2 && parts.form && !parts.comma) return { ...parts, comma: true };
  const stripped = { ...parts, base: strip(parts.base), form: parts.form ? strip(parts.form) : undefined, comma: false };
  return stripped;
}

export function caseVariant(parts: NameParts, rnd: Random): NameParts | null {
  const roll = rnd.int(3);
  const f = roll === 0 ? (s: string) => s.toUpperCase() : roll === 1 ? (s: string) => s.toLowerCase() : titleCase;
  return { ...parts, base: f(parts.base), form: parts.form ? f(parts.form) : undefined };
}

function titleCase(s: string): string {
  return s
    .split(' ')
    .map((w) => (w.length > 0 ? w[0]!.toUpperCase() + w.slice(1).toLowerCase() : w))
    .join(' ');
}
