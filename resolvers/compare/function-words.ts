/**
 * The function words of names, kept apart from the name comparison because two of its rules read them: a shared
 * function word is no shared word, and a function word abbreviates nothing.
 */

/** Words so common in names that sharing them alone says nothing ("of", "de", "und"). Common practice. */
export const FUNCTION_WORDS: ReadonlySet<string> = new Set([
  'the',
  'of',
  'and',
  'for',
  'de',
  'des',
  'du',
  'la',
  'le',
  'les',
  'del',
  'di',
  'da',
  'do',
  'dos',
  'das',
  'der',
  'die',
  'den',
  'und',
  'et',
  'e',
  'y',
  'i',
  'en',
  'in',
  'van',
  'von',
  'zu',
  'al',
  'el',
  'a',
  'an',
  'at',
]);
