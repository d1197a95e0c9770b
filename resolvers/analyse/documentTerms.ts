/**
 * What a contract defines or cites that is a thing, never a party: the document itself ("this Agreement"), its
 * dates, subject matter and parts ("the Effective Date", "the Services", "the Territory"). Common practice in
 * contract drafting. resolvers/terms adds the collective words it also never binds to one party (NON_PARTY_TERMS).
 */
export const DOCUMENT_TERMS: ReadonlySet<string> = new Set([
  'agreement', 'master agreement', 'effective date', 'commencement date', 'start date', 'closing date', 'closing',
  'effective time', 'execution date', 'territory', 'term', 'initial term', 'renewal term', 'products', 'product',
  'services', 'service', 'software', 'licensed software', 'confidential information', 'intellectual property',
  'deliverables', 'fees', 'fee', 'purchase price', 'price', 'shares', 'contract', 'deed', 'licence', 'license',
  'goods', 'equipment', 'premises', 'property', 'loan', 'facility', 'guarantee', 'amendment', 'order',
  'purchase order', 'statement of work', 'sow', 'work', 'works', 'purpose', 'business', 'project', 'plan',
  'schedule', 'annex', 'exhibit', 'transaction', 'vertrag', 'contrat',
  'contrato', 'contratto', 'accord', 'convention', "date d'effet", 'stichtag', 'prestations', 'leistungen',
  'servicios', 'servizi', 'site', 'system', 'platform', 'data', 'personal data', 'materials', 'marks',
  'trademarks', 'patents', 'licensed patents', 'loan amount', 'notes', 'securities', 'units', 'interest',
  // Added with issue 16: more of the same kinds (documents, dates, periods, parts), also common practice.
  'agreements', 'contracts', 'addendum', 'side letter', 'order form', 'terms', 'terms and conditions',
  'conditions', 'appendix', 'attachment', 'schedules', 'annexes', 'exhibits', 'recitals', 'clause', 'clauses',
  'section', 'sections', 'article', 'articles', 'signature date', 'completion date', 'completion',
  'delivery date', 'expiry date', 'expiration date', 'termination date', 'renewal date', 'go live date',
  'service levels', 'service level agreement', 'sla', 'specification', 'specifications', 'documentation',
  'licensed products', 'licensed territory', 'field', 'field of use', 'term sheet', 'data processing agreement',
  'dpa', 'processing', 'purposes', 'sub processing', 'standard contractual clauses', 'clauses', 'consideration',
  'retainer', 'budget', 'milestones', 'milestone', 'royalties', 'royalty', 'charges', 'invoice', 'invoices',
]);

/**
 * Heads that cite a part of a document when a number or letter follows ("Schedule 2", "Annex A", "Clause 4.2",
 * "Amendment No. 3"). Common practice.
 */
export const DOCUMENT_PART_HEADS: ReadonlySet<string> = new Set([
  'schedule', 'annex', 'exhibit', 'appendix', 'attachment', 'clause', 'section', 'article', 'paragraph', 'part',
  'recital', 'amendment', 'addendum', 'sow', 'order', 'rider', 'chapter', 'table', 'anlage', 'annexe', 'anexo',
  'allegato', 'bijlage', 'ziffer', 'articolo', 'artikel', 'clausula',
]);

/** Nouns that end a document's title: "the Master Services Agreement", "this Deed of Variation". */
export const DOCUMENT_NOUNS: ReadonlySet<string> = new Set([
  'agreement', 'agreements', 'contract', 'deed', 'amendment', 'addendum', 'letter', 'memorandum', 'instrument',
  'indenture', 'schedule', 'annex', 'exhibit', 'appendix', 'form', 'order', 'terms', 'conditions', 'policy',
]);
