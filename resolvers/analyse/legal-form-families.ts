/**
 * Equivalence families of legal-form designators, used for matching ("Ltd" ≡ "Limited").
 * Keys and values are designator keys (see designator-key.ts). A designator not listed here has the
 * family of its own key when it is an abbreviation, or of its row's first abbreviation when it is a
 * full local name (so "Aktiengesellschaft" joins "ag").
 *
 * Sources: UK Companies Act 2006 Part 5, ss. 58–59 (required indications: "limited"/"ltd.",
 * "public limited company"/"p.l.c.", Welsh "cyfyngedig"/"cyf." and "cwmni cyfyngedig cyhoeddus"/"c.c.c.");
 * the GB rows of the ISO 20275 ELF list v1.5 (H0PO, B6ES, Z0EY, ID30); the rest is common practice.
 */
export const FAMILY_ALIASES: Readonly<Record<string, string>> = {
  ltd: 'ltd',
  limited: 'ltd',
  privatelimitedcompany: 'ltd',
  cyf: 'ltd',
  cyfyngedig: 'ltd',
  inc: 'inc',
  incorporated: 'inc',
  corp: 'corp',
  corporation: 'corp',
  co: 'co',
  company: 'co',
  plc: 'plc',
  publiclimitedcompany: 'plc',
  ccc: 'plc',
  cwmnicyfyngedigcyhoeddus: 'plc',
  llp: 'llp',
  limitedliabilitypartnership: 'llp',
  pac: 'llp',
  partneriaethatebolrwyddcyfyngedig: 'llp',
  llc: 'llc',
  limitedliabilitycompany: 'llc',
  lp: 'lp',
  limitedpartnership: 'lp',
  lllp: 'lllp',
  limitedliabilitylimitedpartnership: 'lllp',
  ptyltd: 'ptyltd',
  ptylimited: 'ptyltd',
  proprietarylimited: 'ptyltd',
  proprietaryltd: 'ptyltd',
  limitedproprietarycompany: 'ptyltd',
  gmbh: 'gmbh',
  gesellschaftmitbeschrankterhaftung: 'gmbh',
  gesellschaftmitbeschraenkterhaftung: 'gmbh',
  ag: 'ag',
  aktiengesellschaft: 'ag',
  sarl: 'sarl',
  societearesponsabilitelimitee: 'sarl',
  pc: 'pc',
  professionalcorporation: 'pc',
  pllc: 'pllc',
  kk: 'kk',
  kabushikikaisha: 'kk',
  gk: 'gk',
  godokaisha: 'gk',
  lda: 'lda',
  limitada: 'lda',
  // ES "Sociedad Limitada" (legal-form-supplement.ts) joins the first abbreviation of its row DP3Q, "S.L.".
  sociedadlimitada: 'sl',
  // Russian abbreviations and their transliterations share a family (see legal-form-supplement.ts).
  ооо: 'ooo',
  ао: 'ao',
  пао: 'pao',
  оао: 'oao',
  зао: 'zao',
  professionallimitedliabilitycompany: 'pllc',
};
