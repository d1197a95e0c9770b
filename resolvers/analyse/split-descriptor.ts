/**
 * Contract-style descriptors after a name: "Brackenridge Fabrication, Inc., a Delaware corporation",
 * "Orrin Mill Limited, a company incorporated in England and Wales". The descriptor is not part of the name:
 * its place becomes a qualifier, and its legal form stands in when the name itself carries none.
 * Common practice in contract drafting.
 */
import type { LegalFormSpan } from './match-legal-form.ts';
import { matchSuffixForm } from './match-legal-form.ts';
import { normaliseTokens } from './normalise-name.ts';
import { scanName } from './scan-name.ts';

export interface Descriptor {
  /** Where the name ends (the comma before "a"/"an"). */
  headEnd: number;
  /** The normalised place ("delaware", "england and wales"), or "" when none is given. */
  place: string;
  /** The descriptor's legal form, with offsets in the primary text. */
  form: LegalFormSpan | null;
}

/** Descriptors longer than this are read as part of the name. */
const MAX_DESCRIPTOR_WORDS = 16;
const INCORPORATION_WORDS: ReadonlySet<string> = new Set([
  'incorporated',
  'organized',
  'organised',
  'registered',
  'existing',
  'formed',
  'established',
  'constituted',
]);
const PLACE_NOISE: ReadonlySet<string> = new Set(['the', 'state', 'commonwealth', 'province', 'laws', 'law', 'republic', 'kingdom', 'of']);

export function splitDescriptor(primary: string): Descriptor | null {
  const at = lastArticleComma(primary);
  if (at <= 0) return null;
  const tailStart = primary.indexOf(' ', at + 2) + 1; // after "a" / "an"
  const tail = primary.slice(tailStart);
  const words = normaliseTokens(tail);
  if (words.length === 0 || words.length > MAX_DESCRIPTOR_WORDS) return null;
  if (normaliseTokens(primary.slice(0, at)).length === 0) return null;

  const incorporation = words.findIndex((w) => INCORPORATION_WORDS.has(w));
  if (incorporation >= 0) {
    let from = words.length;
    for (let k = words.length - 1; k > incorporation; k--) {
      if (words[k] === 'in' || words[k] === 'of' || words[k] === 'under') {
        from = k + 1;
        break;
      }
    }
    return { headEnd: at, place: placeOf(words.slice(from)), form: null };
  }
  // "a Delaware corporation": the descriptor ends with a legal form; what comes before it is the place.
  const descriptorText = primary.slice(at + 1);
  const scan = scanName(descriptorText);
  const form = matchSuffixForm(descriptorText, scan, scan.length, descriptorText.length);
  if (!form) return null;
  const offset = at + 1;
  const placeText = primary.slice(tailStart, form.start + offset);
  return {
    headEnd: at,
    place: placeOf(normaliseTokens(placeText)),
    form: { ...form, start: form.start + offset, end: form.end + offset },
  };
}

/** Offset of the last ", a " / ", an " (any case), or -1. Scans commas only: no lower-casing of the whole name. */
function lastArticleComma(text: string): number {
  for (let at = text.lastIndexOf(','); at > 0; at = text.lastIndexOf(',', at - 1)) {
    if (text.charCodeAt(at + 1) !== 0x20) continue;
    const a = text.charCodeAt(at + 2) | 0x20;
    if (a !== 0x61) continue;
    const next = text.charCodeAt(at + 3);
    if (next === 0x20) return at;
    if ((next | 0x20) === 0x6e && text.charCodeAt(at + 4) === 0x20) return at;
  }
  return -1;
}

function placeOf(words: string[]): string {
  return words.filter((w) => !PLACE_NOISE.has(w)).join(' ');
}
