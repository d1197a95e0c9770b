/**
 * Other spellings of one name that matching also tries: the names the string itself introduces as the same party
 * ("X d/b/a Y", "X f/k/a Y", "X a/k/a Y", "X in forma abbreviata Y": aliases; never a successor or a related
 * party), and a Latin transliteration of a name written in an alphabet of its own (Cyrillic, Greek, Armenian,
 * Georgian), so that "Балтийский Кредит" meets "Baltiyskiy Kredit". Scripts written without spaces are not
 * transliterated: their romanisation (pinyin, romaji) rarely matches the way such a company writes its Latin name.
 * Arabic and Hebrew are left out too, measured (issue 15): these scripts mostly omit short vowels, so the table
 * gives a consonant skeleton ("mSrf qTr lslmy" for a name whose Latin form is "Qatar Islamic Bank") and such
 * companies' Latin names are mostly translations. With both scripts added, LEI dev (94 Arabic and 17 Hebrew names):
 * no link gained or lost, 1,130 more candidate pairs; ROR test: one more true link (2,596 → 2,597), 806 more pairs;
 * generated names: unchanged. Of the 110 LEI dev entities with such a name, 10 have a second name and none of the
 * ten transliterations shares a word with it.
 * Transliteration: the `transliteration` package (general-purpose Unicode-to-ASCII tables).
 */
import { transliterate } from 'transliteration';
import type { AliasKind } from '../vocabulary.ts';
import { normaliseTokens } from './normalise-name.ts';

export interface NameAlternative {
  /** `without_form`: the name read without a word that is a legal form only abroad ("Brackenridge Fab." in US). */
  kind: 'alias' | 'latin' | 'without_form';
  /** Core tokens of the alternative, as the analysis gives them for a name. */
  tokens: string[];
  core: string;
}

/** Alias kinds that name the same party (a former name too: a mention of it still means the party). */
const SAME_PARTY: ReadonlySet<AliasKind> = new Set<AliasKind>(['trade', 'former', 'also_known_as']);

/** Cyrillic, Greek, Armenian, Georgian letters (not Hebrew or Arabic: see the note at the top). */
function hasOwnAlphabet(text: string): boolean {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if ((c >= 0x0370 && c <= 0x058f) || (c >= 0x10a0 && c <= 0x10ff) || (c >= 0x1f00 && c <= 0x1fff)) return true;
  }
  return false;
}

export function alternativeNames(
  core: string,
  aliases: readonly { kind: AliasKind; name: string }[],
  analyseAlias: (name: string) => { core: string; tokens: string[] },
): NameAlternative[] {
  const out: NameAlternative[] = [];
  const seen = new Set<string>([core]);
  for (const alias of aliases) {
    if (!SAME_PARTY.has(alias.kind)) continue;
    const analysed = analyseAlias(alias.name);
    if (analysed.tokens.length === 0 || seen.has(analysed.core)) continue;
    seen.add(analysed.core);
    out.push({ kind: 'alias', tokens: analysed.tokens, core: analysed.core });
  }
  if (hasOwnAlphabet(core)) {
    const tokens = normaliseTokens(transliterate(core));
    const latin = tokens.join(' ');
    if (tokens.length > 0 && !seen.has(latin)) out.push({ kind: 'latin', tokens, core: latin });
  }
  return out;
}
