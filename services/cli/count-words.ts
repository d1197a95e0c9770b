/** Counts in words for what the command line prints: the en-US digit grouping and a noun in the right number. */

/** "1 row", "2 rows", "1,480 rows": a count in the en-US grouping every progress line uses, with its noun. */
export function countOf(count: number, one: string, many = pluralOf(one)): string {
  return `${count.toLocaleString('en-US')} ${count === 1 ? one : many}`;
}

/** The plural of a unit word as the progress lines use them ("row", "vendor row", "entity", "mention"). */
export function pluralOf(word: string): string {
  if (/[^aeiou]y$/.test(word)) return `${word.slice(0, -1)}ies`;
  return /(?:s|x|ch|sh)$/.test(word) ? `${word}es` : `${word}s`;
}

/** The singular of a plural unit ("rows" → "row", "entities" → "entity"), for callers that name the unit by its plural. */
export function singularOf(plural: string): string {
  if (plural.endsWith('ies')) return `${plural.slice(0, -3)}y`;
  return plural.endsWith('s') ? plural.slice(0, -1) : plural;
}
