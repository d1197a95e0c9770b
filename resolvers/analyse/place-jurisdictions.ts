/**
 * Places named in contract descriptors ("a Delaware corporation", "incorporated in England and Wales") mapped to
 * ISO 3166-2 / 3166-1 codes, so that the descriptor narrows the legal-form codes like a country hint.
 * US states: US_STATES (us-states.ts, shared with resolvers/terms); country names are their common English names.
 */
import { US_STATES } from './us-states.ts';

export const PLACE_JURISDICTIONS: ReadonlyMap<string, string> = new Map([
  ...US_STATES,
  // Descriptors here may name the District by "Columbia" alone; kept out of US_STATES, which the terms stage reads too.
  ['columbia', 'US-DC'],
  ['england and wales', 'GB'],
  ['england', 'GB'],
  ['wales', 'GB'],
  ['scotland', 'GB'],
  ['northern ireland', 'GB'],
  ['united kingdom', 'GB'],
  ['ireland', 'IE'],
  ['germany', 'DE'],
  ['france', 'FR'],
  ['netherlands', 'NL'],
  ['luxembourg', 'LU'],
  ['switzerland', 'CH'],
  ['spain', 'ES'],
  ['italy', 'IT'],
  ['australia', 'AU'],
  ['canada', 'CA'],
  ['japan', 'JP'],
  ['singapore', 'SG'],
  ['hong kong', 'HK'],
  ['mexico', 'MX'],
  ['sweden', 'SE'],
  ['norway', 'NO'],
  ['denmark', 'DK'],
  ['finland', 'FI'],
  ['belgium', 'BE'],
  ['austria', 'AT'],
  ['poland', 'PL'],
]);
