/**
 * The words of a person's name that both readers of person names share: name analysis (looks-like-person-name.ts,
 * a whole name judged) and contract terms (resolvers/terms/read-person-name.ts, a name read after a signature cue).
 * Each reader adds the words only it takes (its own comment says why). Common practice.
 */

/** Forms of address both readers skip before a name ("Mr", "Dr.", "Herr", "Sra."). */
export const FORMS_OF_ADDRESS: readonly string[] = ['mr', 'mrs', 'ms', 'miss', 'mx', 'dr', 'prof', 'sir', 'dame', 'herr', 'frau', 'mme', 'sr', 'sra', 'dott'];

/** Lower-case particles inside a family name ("Maria van der Linde", "Ibn al Haytham"). */
export const FAMILY_NAME_PARTICLES: readonly string[] = [
  'van',
  'von',
  'de',
  'der',
  'den',
  'da',
  'di',
  'du',
  'del',
  'della',
  'le',
  'la',
  'ten',
  'ter',
  'bin',
  'ibn',
  'al',
  'dos',
  'das',
];
