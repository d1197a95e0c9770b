/**
 * The places a contract names in its governing-law and venue clauses ("governed by the laws of the State of New
 * York", "the courts of England and Wales"), as written: parseParties lists them among the non-parties so that a
 * reviewer sees why a mention of them was left out. The framing ("laws of", "courts of", "jurisdiction of") is
 * common practice; whether the words after it name a place is resolvers/analyse's test (ISO 3166 names).
 */
import { analyseCached } from './analyse-cached.ts';

/** A law or venue phrase ending in "of"; the place follows. */
const FRAME = /\b(?:laws?|courts?|tribunals?|jurisdiction|droit|recht|derecho|diritto)\s+(?:of|de|des|du|von|der|di|del)\s+/giu;
/** Words a place name may run to ("the Commonwealth of the Northern Mariana Islands"). */
const MAX_WORDS = 8;
/** Places kept per contract: enough for any real clause, bounded for adversarial text. */
const MAX_PLACES = 20;

export function findPlaceMentions(text: string): string[] {
  const out: string[] = [];
  for (const m of text.matchAll(FRAME)) {
    if (out.length >= MAX_PLACES) break;
    const from = (m.index ?? 0) + m[0].length;
    const words = placeWords(text.slice(from, from + 200));
    for (let n = words.length; n > 0; n--) {
      const candidate = words.slice(0, n).join(' ');
      if (!/\p{Lu}/u.test(candidate.charAt(candidate.startsWith('the ') ? 4 : 0))) continue;
      if (analyseCached(candidate).partyReason !== 'place') continue;
      if (!out.includes(candidate)) out.push(candidate);
      break;
    }
  }
  return out;
}

/** The words before the first punctuation mark or line break, at most MAX_WORDS. */
function placeWords(s: string): string[] {
  const stop = s.search(/[,;:.()\n\r"“”]/u);
  return (stop < 0 ? s : s.slice(0, stop))
    .split(/\s+/u)
    .filter((w) => w.length > 0)
    .slice(0, MAX_WORDS);
}
