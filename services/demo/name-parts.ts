/**
 * Word material for invented organisation and person names. Every name is coined from syllables, so the
 * generators never reproduce a real company or person on purpose; descriptor and industry words are
 * ordinary dictionary words. The lists are written by kind in name-parts/; this module gathers them, so that the
 * generators import one module.
 */
export { SYLLABLES, ENDINGS } from './name-parts/coined-words.ts';
export { INDUSTRIES, LOCAL_INDUSTRIES, DESCRIPTORS } from './name-parts/activity-words.ts';
export { GIVEN_NAMES } from './name-parts/given-names.ts';
export { LEGAL_FORMS, type LegalFormFamily } from './name-parts/legal-forms.ts';
export { JURISDICTIONS, countryOf } from './name-parts/jurisdictions.ts';
