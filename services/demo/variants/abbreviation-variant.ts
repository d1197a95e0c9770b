/**
 * A name with one word abbreviated as company names abbreviate it ("Intl", "Mfg"), or shortened to its initials.
 */
import type { Random } from '../../../resolvers/prng.ts';
import type { NameParts } from '../render-name.ts';

/** Word abbreviations seen in company names (common practice). */
export const WORD_ABBREVIATIONS: Readonly<Record<string, readonly string[]>> = {
  International: ['Intl', "Int'l", 'Intl.'],
  Engineering: ['Eng.', 'Engg', 'Eng'],
  Technologies: ['Tech', 'Techs', 'Technol.'],
  Services: ['Svcs', 'Servs.', 'Svc'],
  Systems: ['Sys.', 'Sys'],
  Solutions: ['Sol.', 'Solns'],
  Industries: ['Inds', 'Ind.'],
  Logistics: ['Log.', 'Logist.'],
  Manufacturing: ['Mfg', 'Mfg.'],
  Pharmaceuticals: ['Pharma', 'Pharm.'],
  Electronics: ['Elec.', 'Electr.'],
  Components: ['Comp.', 'Cmpts'],
  Construction: ['Constr.', 'Const.'],
  Consulting: ['Cons.', 'Consult.'],
  Laboratories: ['Labs'],
  Holdings: ['Hldgs', 'Hldg'],
  Partners: ['Ptnrs'],
  Brothers: ['Bros.', 'Bros'],
  Company: ['Co.', 'Co'],
  North: ['N.'],
  Northern: ['Nthn'],
  Western: ['W.'],
  Eastern: ['E.'],
  Central: ['Ctrl', 'Cent.'],
  Medical: ['Med.'],
  Instruments: ['Instr.'],
  Materials: ['Matls'],
  Analytics: ['Analyt.'],
  and: ['&'],
};

export function abbreviationVariant(parts: NameParts, rnd: Random): NameParts | null {
  const words = parts.base.split(' ');
  const abbreviable = words.map((w, i) => (WORD_ABBREVIATIONS[w] ? i : -1)).filter((i) => i >= 0);
  // An acronym of the name words ("Northfield Rail Components" → "NRC") one time in four, if long enough.
  const capitals = words.filter((w) => /^[A-Z]/.test(w));
  if ((abbreviable.length === 0 || rnd.chance(0.25)) && capitals.length >= 2) {
    const acronym = capitals.map((w) => w[0]).join('');
    return { ...parts, base: acronym };
  }
  if (abbreviable.length === 0) return null;
  const i = rnd.pick(abbreviable);
  words[i] = rnd.pick(WORD_ABBREVIATIONS[words[i]!]!);
  return { ...parts, base: words.join(' ') };
}
