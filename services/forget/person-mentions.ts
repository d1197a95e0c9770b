/**
 * Mentions that name the person being forgotten without being linked to them. Linked mentions are found by their
 * counterparty; these are not:
 *  - a mention waiting in the review queue with the person as its candidate (an open review item pointing at the
 *    cluster), whatever its text;
 *  - a mention linked to no counterparty whose text is one of the person's names in a short form: initial and
 *    surname ("J. Smith", "Smith, J."), given name and surname in either order, with or without a title.
 * A mention linked to another counterparty is never touched: "J. Smith" there is someone else's record.
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../db/types.ts';
import { openReviewMentionsOf, unlinkedMentionsContaining } from '../../db/queries/erasure-reads.ts';

/** Titles dropped before comparing (common practice in English-language records; from memory). */
const TITLES = new Set(['mr', 'mrs', 'ms', 'miss', 'mx', 'dr', 'prof', 'sir', 'dame']);
/** A surname shorter than this is not searched for (too many unrelated texts hold it). */
const MIN_SURNAME = 3;

/** Lower case, accents and punctuation removed, titles dropped: "Dr. J. Smith" → ["j", "smith"]. */
export function nameTokens(text: string): string[] {
  const plain = text.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase();
  const tokens = plain.split(/[^\p{L}\p{N}]+/u).filter((t) => t !== '');
  while (tokens.length > 0 && TITLES.has(tokens[0]!)) tokens.shift();
  return tokens;
}

/** The short forms of a person's name, as token strings; empty for a name of fewer than two words. */
export function shortForms(name: string): { forms: Set<string>; surname: string | undefined } {
  const tokens = nameTokens(name);
  const forms = new Set<string>();
  if (tokens.length < 2) return { forms, surname: undefined };
  const given = tokens[0]!;
  const surname = tokens[tokens.length - 1]!;
  if (surname.length < MIN_SURNAME) return { forms, surname: undefined };
  for (const form of [tokens, [given[0]!, surname], [surname, given[0]!], [given, surname], [surname, given]]) forms.add(form.join(' '));
  return { forms, surname };
}

/** Ids of the mentions described above, for the names the cluster holds and held. */
export async function mentionsNamingPerson(trx: Transaction<Database>, cluster: number[], names: readonly string[]): Promise<number[]> {
  const found = new Set<number>();
  for (const mentionId of await openReviewMentionsOf(trx, cluster)) found.add(mentionId);

  const forms = new Set<string>();
  const surnames = new Set<string>();
  for (const name of names) {
    const short = shortForms(name);
    for (const form of short.forms) forms.add(form);
    if (!short.surname) continue;
    // Searched both folded and as written: lower() keeps accents, so "bréval" is found only as itself.
    surnames.add(short.surname);
    const written = name
      .toLowerCase()
      .split(/[^\p{L}\p{N}]+/u)
      .filter((t) => t !== '')
      .pop();
    if (written) surnames.add(written);
  }
  if (surnames.size === 0) return [...found].sort((a, b) => a - b);
  // The surname narrows the search in SQL; the whole text is then compared as tokens.
  const unlinked = await unlinkedMentionsContaining(trx, [...surnames]);
  for (const row of unlinked) if (forms.has(nameTokens(row.text).join(' '))) found.add(row.id);
  return [...found].sort((a, b) => a - b);
}
