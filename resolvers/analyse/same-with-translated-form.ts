/**
 * Whether two analysed names are one entity written with its legal form in the local language on one side and in
 * an English rendering of that same form on the other ("Orvanel Japan K.K." and "Orvanel Japan Co., Ltd."). Only
 * a local form of one country counts, and only the renderings TRANSLATED_LEGAL_FORMS lists for it there.
 */
import type { NameAnalysis } from './types.ts';
import { TRANSLATED_LEGAL_FORMS } from './translated-legal-forms.ts';

/** "Co." or "Company" before "Ltd." belongs to the rendering "Co., Ltd.", not to the name. */
const CO_WORDS: ReadonlySet<string> = new Set(['co', 'company']);

export function sameWithTranslatedForm(a: NameAnalysis, b: NameAnalysis): boolean {
  return oneWay(a, b) || oneWay(b, a);
}

/** The local families any country lists renderings for: a cheap first test, as parsers call this per name pair. */
const LOCAL_FAMILIES: ReadonlySet<string> = new Set(Object.values(TRANSLATED_LEGAL_FORMS).flatMap((byFamily) => Object.keys(byFamily)));

function oneWay(local: NameAnalysis, rendered: NameAnalysis): boolean {
  const form = local.legalForm;
  if (form === null || !LOCAL_FAMILIES.has(form.family) || rendered.legalForm === null || local.core.length === 0) return false;
  const countries = new Set(form.jurisdictions.map((j) => j.slice(0, 2)));
  if (countries.size !== 1) return false;
  const renderings = TRANSLATED_LEGAL_FORMS[[...countries][0] as string]?.[form.family];
  if (renderings === undefined) return false;
  const r = renderedForm(rendered);
  return r.core === local.core && renderings.includes(r.form);
}

/** The core and form of a name as its English rendering reads: "orvanel japan co" + ltd → "orvanel japan", "co ltd". */
function renderedForm(n: NameAnalysis): { core: string; form: string } {
  const family = n.legalForm?.family ?? '';
  const last = n.tokens[n.tokens.length - 1];
  if (family === 'ltd' && n.tokens.length > 1 && last !== undefined && CO_WORDS.has(last)) {
    return { core: n.tokens.slice(0, -1).join(' '), form: 'co ltd' };
  }
  return { core: n.core, form: family };
}
