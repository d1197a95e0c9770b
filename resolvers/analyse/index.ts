/** Public surface of name analysis. */
export type { AnalyseHints, LegalFormMatch, NameAnalysis } from './types.ts';
export { analyseName } from './analyseName.ts';
export { normaliseName, normaliseTokens, foldForComparison, foldGermanDigraphs } from './normaliseName.ts';
export { designatorKey } from './designatorKey.ts';
export { lookupLegalForm, legalFormFamily, findLegalForm } from './lookupLegalForm.ts';
export type { LegalFormInfo } from './lookupLegalForm.ts';
export { partyVerdict, PRONOUNS, ROLE_WORDS, SIGNATURE_LABELS } from './partyFilter.ts';
export type { PartyReason } from './partyFilter.ts';
export { isPlacePhrase } from './isPlacePhrase.ts';
export { isDocumentReference } from './isDocumentReference.ts';
export { splitAliases } from './splitAliases.ts';
export { looksLikePersonName } from './looksLikePersonName.ts';
export { isPrefixJurisdiction } from './legalFormIndex.ts';
export { validateCountry } from './narrowCodes.ts';
export type { NameAlternative } from './alternativeNames.ts';
export { DOCUMENT_TERMS } from './documentTerms.ts';
export { sameWithTranslatedForm } from './sameWithTranslatedForm.ts';
