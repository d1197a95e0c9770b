/**
 * Defined terms that name things, never parties (`this "Agreement"`, the "Effective Date", the "Territory").
 * A guard on top of the structural test: a term in this list is never bound to a party (common practice).
 */
export const NON_PARTY_TERMS: ReadonlySet<string> = new Set([
  'agreement', 'master agreement', 'effective date', 'commencement date', 'start date', 'closing date', 'closing',
  'effective time', 'execution date', 'territory', 'term', 'initial term', 'renewal term', 'products', 'product',
  'services', 'service', 'software', 'licensed software', 'confidential information', 'intellectual property',
  'deliverables', 'fees', 'fee', 'purchase price', 'price', 'shares', 'contract', 'deed', 'licence', 'license',
  'goods', 'equipment', 'premises', 'property', 'loan', 'facility', 'guarantee', 'amendment', 'order',
  'purchase order', 'statement of work', 'sow', 'work', 'works', 'purpose', 'business', 'project', 'plan',
  'schedule', 'annex', 'exhibit', 'transaction', 'affiliates', 'affiliate', 'subsidiaries', 'vertrag', 'contrat',
  'contrato', 'contratto', 'accord', 'convention', "date d'effet", 'stichtag', 'prestations', 'leistungen',
  'servicios', 'servizi', 'site', 'system', 'platform', 'data', 'personal data', 'materials', 'marks',
  'trademarks', 'patents', 'licensed patents', 'loan amount', 'notes', 'securities', 'units', 'interest',
]);
