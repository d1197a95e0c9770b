/** Public surface of name analysis. */
export type { AnalyseHints, LegalFormMatch, NameAnalysis } from './types.ts';
export { analyseName } from './analyse-name.ts';
export { normaliseName, normaliseTokens, foldForComparison, foldGermanDigraphs } from './normalise-name.ts';
export { designatorKey } from './designator-key.ts';
export { lookupLegalForm, legalFormFamily, findLegalForm } from './lookup-legal-form.ts';
export type { LegalFormInfo } from './lookup-legal-form.ts';
export { partyVerdict, PRONOUNS, ROLE_WORDS, SIGNATURE_LABELS } from './party-filter.ts';
export type { PartyReason } from './party-filter.ts';
export { isPlacePhrase } from './is-place-phrase.ts';
export { isDocumentReference } from './is-document-reference.ts';
export { splitAliases } from './split-aliases.ts';
export { looksLikePersonName } from './looks-like-person-name.ts';
export { isPrefixJurisdiction } from './legal-form-index.ts';
export { validateCountry } from './narrow-codes.ts';
export type { NameAlternative } from './alternative-names.ts';
export { DOCUMENT_TERMS } from './document-terms.ts';
export { sameWithTranslatedForm } from './same-with-translated-form.ts';
