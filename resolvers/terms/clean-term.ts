/** A defined term as the contract binds it: no quotes, no leading article, no possessive. */

const ARTICLES = ['the ', 'le ', 'la ', "l'", 'l’', 'les ', 'el ', 'los ', 'las ', 'il ', 'lo ', 'der ', 'die ', 'das ', 'het ', 'de '];

export function cleanTerm(raw: string): string {
  let t = raw.trim();
  // US drafting puts the comma inside the quotes: (“Orchard,” “we,” or “us”).
  while (t.length > 1 && (t.endsWith(',') || t.endsWith(';') || t.endsWith(':'))) t = t.slice(0, -1).trimEnd();
  const lower = t.toLowerCase();
  for (const a of ARTICLES) {
    if (lower.startsWith(a) && t.length > a.length) {
      t = t.slice(a.length).trim();
      break;
    }
  }
  return t;
}

/** The key a mention and a term are compared on: folded case and spacing, article and possessive dropped. */
export function termKey(raw: string): string {
  let t = stripQuotes(raw.normalize('NFKC'));
  t = t.replace(/(?:'s|’s|s'|s’)$/u, (m) => (m.startsWith('s') ? 's' : ''));
  const lower = t.toLowerCase();
  for (const w of ['this ', 'each ', 'either ', 'any ', 'such ', 'said ', 'both ']) {
    if (lower.startsWith(w)) {
      t = t.slice(w.length);
      break;
    }
  }
  return cleanTerm(t).toLowerCase().split(/\s+/u).join(' ');
}

const QUOTE_OR_SPACE = new Set([...'"\'“”„‘’«» \t\n\r\u00a0']);

function stripQuotes(s: string): string {
  let a = 0;
  let b = s.length;
  while (a < b && QUOTE_OR_SPACE.has(s[a] as string)) a++;
  while (b > a && QUOTE_OR_SPACE.has(s[b - 1] as string)) b--;
  return s.slice(a, b);
}
