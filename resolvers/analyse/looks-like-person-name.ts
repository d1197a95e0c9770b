/**
 * Does a name without legal form look like a natural person's name (given name + family name)?
 * Evidence needed beyond "two capitalised words": an honorific (Mr, Dr …) or a published given name first
 * (given-names.ts: Moby Word II's first-name lists).
 * Middle initials ("Iolo T. Brannock") and family-name particles (van, de, von …) are allowed but prove nothing
 * ("Caixa Geral de Depositos", "Q Chem" are organisations). Organisation words rule it out.
 * The other word lists (honorifics, suffixes, particles, organisation words) are common practice.
 */

import { GIVEN_NAMES } from './given-names.ts';
import { FAMILY_NAME_PARTICLES, FORMS_OF_ADDRESS } from './person-name-words.ts';

/** Forms of address (FORMS_OF_ADDRESS) and the titles a whole name may open with besides. */
export const HONORIFICS: ReadonlySet<string> = new Set([...FORMS_OF_ADDRESS, 'professor', 'lord', 'lady', 'mlle', 'srta', 'ing', 'mag', 'rev']);
export const PERSON_SUFFIXES: ReadonlySet<string> = new Set(['jr', 'sr', 'ii', 'iii', 'iv', 'phd', 'esq', 'md', 'kc', 'qc', 'cpa']);
const PARTICLES: ReadonlySet<string> = new Set(FAMILY_NAME_PARTICLES);

/** Words that mark an organisation whatever else the name looks like. */
export const ORGANISATION_WORDS: ReadonlySet<string> = new Set(
  (
    'holdings holding group services service solutions systems technologies technology tech industries industrial ' +
    'international global partners associates consulting consultants trading works bank banking capital ventures ' +
    'enterprises enterprise labs laboratories logistics foods food print printing media studio studios foundation ' +
    'trust council university college school academy hospital clinic church society association club institute ' +
    'agency authority ministry department fund funds investments investment properties property estates management ' +
    'construction engineering manufacturing supplies supply products fabrication widgets credit union insurance ' +
    'energy software digital network networks design motors pharma pharmaceuticals health healthcare care medical ' +
    'stores store shop hotel hotels restaurant cafe farm farms brewery press publishing records films productions ' +
    'transport shipping airlines mining metals chemicals textiles electronics systems research centre center office ' +
    'office bureau studio partnership cooperative coop ltd inc llc llp plc corp co company gmbh ag sa bv nv ' +
    'materials aerospace library atelier instituto institut istituto sociedade sociedad societe societa compagnie ' +
    'compania companhia empresa grupo gruppe gruppo clinica klinik fundacion fundacao fondation fondazione stiftung ' +
    'verein universidad universidade universite universitat universita ministerio ministere banco banque banca ' +
    'laboratorio laboratoire industria industrie servicos servicios centro centre zentrum associacao asociacion ' +
    'federation federacao confederacao werke werk bau handel verlag'
  ).split(' '),
);

/**
 * Words of local-government areas: "Travis County", "Orleans Parish", "Lincoln Township" open with a given name
 * and are a place or its authority, never a person (US and UK administrative terms, common practice).
 */
const AREA_WORDS: ReadonlySet<string> = new Set(['county', 'parish', 'borough', 'township', 'canton', 'province', 'municipality', 'district']);

/** `words` are the name's words as written (not folded); `tokens` their normalised forms. */
export function looksLikePersonName(words: readonly string[], tokens: readonly string[]): boolean {
  if (tokens.some((t) => ORGANISATION_WORDS.has(t) || AREA_WORDS.has(t))) return false;
  let i = 0;
  let evidence = false;
  if (i < tokens.length && HONORIFICS.has(tokens[i] as string)) {
    evidence = true;
    i++;
  }
  let end = tokens.length;
  while (end > i && PERSON_SUFFIXES.has(tokens[end - 1] as string)) end--;
  const core = tokens.slice(i, end);
  const written = words.length === tokens.length ? words.slice(i, end) : core;
  if (core.length < 2 || core.length > 5) return false;
  // A given name first is evidence, but in three words or more the second must read as a name too (a given name, an
  // initial, a particle): "Crystal Clear Windows" opens with a given name and is a business.
  if (GIVEN_NAMES.has(core[0] as string) && (core.length === 2 || secondReadsAsName(core[1] as string))) evidence = true;
  for (let k = 0; k < core.length; k++) {
    const t = core[k] as string;
    const w = written[k] as string;
    if (!isAlphabetic(t)) return false;
    if (t.length === 1) {
      if (k === 0 || k === core.length - 1) return false; // "Q Chem", "Party A": not given + family name
      continue;
    }
    if (k > 0 && k < core.length - 1 && PARTICLES.has(t)) continue;
    if (!startsUpper(w)) return false;
  }
  return evidence;
}

function secondReadsAsName(token: string): boolean {
  return token.length === 1 || GIVEN_NAMES.has(token) || PARTICLES.has(token);
}

function isAlphabetic(token: string): boolean {
  for (let i = 0; i < token.length; i++) {
    const c = token.charCodeAt(i);
    if (c >= 0x30 && c <= 0x39) return false;
  }
  return true;
}

function startsUpper(word: string): boolean {
  const first = word.charAt(0);
  return first !== first.toLowerCase();
}
