/**
 * Parties introduced by a label at the start of a line, common in English-language contracts drafted in Asia and
 * in forms: "Party A (Seller): Wuyi Mountain Tea Co., Ltd." The label is the party's defined term (and a label
 * in parentheses a second one). Only names with a legal form are taken: a label line is otherwise ambiguous
 * ("Address: …", "Attention: …").
 */
import { analyseCached as analyseName } from './analyse-cached.ts';
import { cleanTerm } from './clean-term.ts';
import { locateNameAt } from './locate-name.ts';
import type { LocatedName } from './locate-name.ts';

export interface LabelledParty {
  located: LocatedName;
  terms: string[];
}

/** Labels that introduce something other than a party. */
const NOT_PARTY_LABELS = new Set([
  'name',
  'title',
  'by',
  'its',
  'address',
  'registered address',
  'registered office',
  'date',
  'dated',
  'tel',
  'telephone',
  'fax',
  'email',
  'e-mail',
  'attention',
  'attn',
  'signature',
  'signed',
  'witness',
  'company number',
  'vat',
  'vat number',
  'contact',
  'legal representative',
  'authorised representative',
  'authorized representative',
  'bank',
  'account',
  'print name',
  'printed name',
  'position',
  'place',
  'subject',
  're',
  'from',
  'to',
  'cc',
  'note',
  'notes',
  'schedule',
  'notices',
  'notice',
  'copy',
  'copy to',
  'payee',
  'remit to',
  'invoice',
  'invoices',
  'billing',
  'bill to',
  'ship to',
  'shipping',
  'delivery',
  'deliver to',
  'governing law',
  'jurisdiction',
  'law',
  'term',
  'fees',
  'price',
  'product',
  'products',
  'services',
  'reference',
  'ref',
  'project',
  'order',
  'po',
  'contract no',
  'contract no.',
  'agreement',
  'between',
  'and',
  'among',
  'parties',
  'party',
  'witnesses',
  'in the presence of',
  'bank details',
  'payment',
  'account name',
]);
const MAX_LINE = 200;

export function findLabelledParties(text: string): LabelledParty[] {
  const out: LabelledParty[] = [];
  let start = 0;
  while (start < text.length) {
    let end = text.indexOf('\n', start);
    if (end < 0) end = text.length;
    if (end - start <= MAX_LINE) {
      const found = readLine(text, start, end);
      if (found !== null) out.push(found);
    }
    start = end + 1;
  }
  return out;
}

function readLine(text: string, start: number, end: number): LabelledParty | null {
  const colon = text.indexOf(':', start);
  if (colon < 0 || colon >= end) return null;
  const label = text.slice(start, colon).trim();
  if (label.length === 0 || label.length > 40) return null;
  // "Party A (Seller)": the label and the term in parentheses.
  const open = label.indexOf('(');
  const main = (open > 0 ? label.slice(0, open) : label).trim();
  const inner = open > 0 && label.endsWith(')') ? label.slice(open + 1, -1).trim() : '';
  const words = main.split(/\s+/u);
  if (words.length > 2 || !words.every((w) => /^\p{Lu}/u.test(w)) || NOT_PARTY_LABELS.has(main.toLowerCase())) return null;
  const located = locateNameAt(text, colon + 1, end, true);
  if (located === null) return null;
  if (analyseName(text.slice(located.nameStart, located.nameEnd)).legalForm === null) return null;
  // The role in parentheses comes first so that it, not "Party A", is reported as the role.
  const terms = [cleanTerm(main)];
  if (inner.length > 0 && /^\p{Lu}/u.test(inner) && !/\d/u.test(inner)) terms.unshift(cleanTerm(inner));
  return { located, terms };
}
