/**
 * Places named in contract descriptors ("a Delaware corporation", "incorporated in England and Wales") mapped to
 * ISO 3166-2 / 3166-1 codes, so that the descriptor narrows the legal-form codes like a country hint.
 * US subdivision codes from ISO 3166-2:US (from memory); country names are their common English names.
 */
export const PLACE_JURISDICTIONS: ReadonlyMap<string, string> = new Map([
  ['alabama', 'US-AL'], ['alaska', 'US-AK'], ['arizona', 'US-AZ'], ['arkansas', 'US-AR'], ['california', 'US-CA'],
  ['colorado', 'US-CO'], ['connecticut', 'US-CT'], ['delaware', 'US-DE'], ['district of columbia', 'US-DC'],
  ['columbia', 'US-DC'], ['florida', 'US-FL'], ['georgia', 'US-GA'], ['hawaii', 'US-HI'], ['idaho', 'US-ID'],
  ['illinois', 'US-IL'], ['indiana', 'US-IN'], ['iowa', 'US-IA'], ['kansas', 'US-KS'], ['kentucky', 'US-KY'],
  ['louisiana', 'US-LA'], ['maine', 'US-ME'], ['maryland', 'US-MD'], ['massachusetts', 'US-MA'], ['michigan', 'US-MI'],
  ['minnesota', 'US-MN'], ['mississippi', 'US-MS'], ['missouri', 'US-MO'], ['montana', 'US-MT'], ['nebraska', 'US-NE'],
  ['nevada', 'US-NV'], ['new hampshire', 'US-NH'], ['new jersey', 'US-NJ'], ['new mexico', 'US-NM'], ['new york', 'US-NY'],
  ['north carolina', 'US-NC'], ['north dakota', 'US-ND'], ['ohio', 'US-OH'], ['oklahoma', 'US-OK'], ['oregon', 'US-OR'],
  ['pennsylvania', 'US-PA'], ['rhode island', 'US-RI'], ['south carolina', 'US-SC'], ['south dakota', 'US-SD'],
  ['tennessee', 'US-TN'], ['texas', 'US-TX'], ['utah', 'US-UT'], ['vermont', 'US-VT'], ['virginia', 'US-VA'],
  ['washington', 'US-WA'], ['west virginia', 'US-WV'], ['wisconsin', 'US-WI'], ['wyoming', 'US-WY'],
  ['england and wales', 'GB'], ['england', 'GB'], ['wales', 'GB'], ['scotland', 'GB'], ['northern ireland', 'GB'],
  ['united kingdom', 'GB'], ['ireland', 'IE'], ['germany', 'DE'], ['france', 'FR'], ['netherlands', 'NL'],
  ['luxembourg', 'LU'], ['switzerland', 'CH'], ['spain', 'ES'], ['italy', 'IT'], ['australia', 'AU'],
  ['canada', 'CA'], ['japan', 'JP'], ['singapore', 'SG'], ['hong kong', 'HK'], ['mexico', 'MX'], ['sweden', 'SE'],
  ['norway', 'NO'], ['denmark', 'DK'], ['finland', 'FI'], ['belgium', 'BE'], ['austria', 'AT'], ['poland', 'PL'],
]);
