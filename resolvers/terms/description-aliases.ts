/**
 * A trade name declared inside the descriptive phrase rather than beside the name: "Ramon Quesada, a sole
 * proprietor doing business as Quesada Green Landscaping" (US and UK drafting of sole traders; common practice).
 */
import { asciiLower } from './ascii-lower.ts';
import type { DeclaredName } from './types.ts';

/** Cues of a trade name, lower case, with the spaces around them. */
const TRADE_CUES = [' doing business as ', ' d/b/a ', ' trading as ', ' t/a ', ' carrying on business as ', ' operating as '];
/** A trade name is a few words; a longer run is a sentence. Common practice. */
const MAX_WORDS = 8;

export function descriptionAliases(description: string): DeclaredName[] {
  const lower = asciiLower(description);
  for (const cue of TRADE_CUES) {
    const at = lower.indexOf(cue);
    if (at < 0) continue;
    const from = at + cue.length;
    let end = from;
    while (end < description.length && !',;("“\n'.includes(description[end] as string)) end++;
    const name = description.slice(from, end).trim();
    if (!/^[\p{Lu}\p{N}]/u.test(name) || name.split(/\s+/u).length > MAX_WORDS) continue;
    return [{ kind: 'trade', name }];
  }
  return [];
}
