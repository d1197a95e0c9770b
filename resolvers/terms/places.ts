/**
 * Place names that descriptive phrases use for a party's jurisdiction, to ISO 3166-1 alpha-2 or ISO 3166-2 codes.
 * Codes: ISO 3166-1 and ISO 3166-2 (US states "US-DE", Australian states "AU-NSW", Canadian provinces "CA-ON").
 */

export const US_STATES: ReadonlyArray<[string, string]> = [
  ['alabama', 'US-AL'], ['alaska', 'US-AK'], ['arizona', 'US-AZ'], ['arkansas', 'US-AR'], ['california', 'US-CA'],
  ['colorado', 'US-CO'], ['connecticut', 'US-CT'], ['delaware', 'US-DE'], ['district of columbia', 'US-DC'],
  ['florida', 'US-FL'], ['georgia', 'US-GA'], ['hawaii', 'US-HI'], ['idaho', 'US-ID'], ['illinois', 'US-IL'],
  ['indiana', 'US-IN'], ['iowa', 'US-IA'], ['kansas', 'US-KS'], ['kentucky', 'US-KY'], ['louisiana', 'US-LA'],
  ['maine', 'US-ME'], ['maryland', 'US-MD'], ['massachusetts', 'US-MA'], ['michigan', 'US-MI'],
  ['minnesota', 'US-MN'], ['mississippi', 'US-MS'], ['missouri', 'US-MO'], ['montana', 'US-MT'],
  ['nebraska', 'US-NE'], ['nevada', 'US-NV'], ['new hampshire', 'US-NH'], ['new jersey', 'US-NJ'],
  ['new mexico', 'US-NM'], ['new york', 'US-NY'], ['north carolina', 'US-NC'], ['north dakota', 'US-ND'],
  ['ohio', 'US-OH'], ['oklahoma', 'US-OK'], ['oregon', 'US-OR'], ['pennsylvania', 'US-PA'],
  ['rhode island', 'US-RI'], ['south carolina', 'US-SC'], ['south dakota', 'US-SD'], ['tennessee', 'US-TN'],
  ['texas', 'US-TX'], ['utah', 'US-UT'], ['vermont', 'US-VT'], ['virginia', 'US-VA'], ['washington', 'US-WA'],
  ['west virginia', 'US-WV'], ['wisconsin', 'US-WI'], ['wyoming', 'US-WY'],
];

export const SUBDIVISIONS: ReadonlyArray<[string, string]> = [
  ['new south wales', 'AU-NSW'], ['victoria', 'AU-VIC'], ['queensland', 'AU-QLD'], ['western australia', 'AU-WA'],
  ['south australia', 'AU-SA'], ['tasmania', 'AU-TAS'], ['australian capital territory', 'AU-ACT'],
  ['northern territory', 'AU-NT'], ['ontario', 'CA-ON'], ['british columbia', 'CA-BC'], ['quebec', 'CA-QC'],
  ['québec', 'CA-QC'], ['alberta', 'CA-AB'],
];

export const COUNTRIES: ReadonlyArray<[string, string]> = [
  ['england and wales', 'GB'], ['england & wales', 'GB'], ['england', 'GB'], ['wales', 'GB'], ['scotland', 'GB'],
  ['northern ireland', 'GB'], ['united kingdom', 'GB'], ['great britain', 'GB'], ['ireland', 'IE'],
  ['republic of ireland', 'IE'], ['federal republic of germany', 'DE'], ['germany', 'DE'], ['deutschland', 'DE'],
  ['france', 'FR'], ['french republic', 'FR'], ['sweden', 'SE'], ['kingdom of sweden', 'SE'], ['netherlands', 'NL'],
  ['kingdom of the netherlands', 'NL'], ['japan', 'JP'], ['australia', 'AU'], ['commonwealth of australia', 'AU'],
  ['canada', 'CA'], ['spain', 'ES'], ['kingdom of spain', 'ES'], ['españa', 'ES'], ['italy', 'IT'], ['italia', 'IT'],
  ['switzerland', 'CH'], ['luxembourg', 'LU'], ['grand duchy of luxembourg', 'LU'], ['belgium', 'BE'],
  ['denmark', 'DK'], ['norway', 'NO'], ['finland', 'FI'], ['austria', 'AT'], ['poland', 'PL'], ['portugal', 'PT'],
  ['singapore', 'SG'], ['hong kong', 'HK'], ['new zealand', 'NZ'], ['cayman islands', 'KY'], ['jersey', 'JE'],
  ['guernsey', 'GG'], ['india', 'IN'], ['brazil', 'BR'], ['mexico', 'MX'], ['china', 'CN'],
  ["people's republic of china", 'CN'], ['republic of korea', 'KR'], ['south korea', 'KR'], ['korea', 'KR'],
  ['united states of america', 'US'], ['united states', 'US'], ['usa', 'US'], ['u.s.a.', 'US'],
];

/** "a Japanese corporation", "an English company", "a Dutch private limited company". */
export const ADJECTIVES: ReadonlyArray<[string, string]> = [
  ['english', 'GB'], ['british', 'GB'], ['scottish', 'GB'], ['irish', 'IE'], ['german', 'DE'], ['french', 'FR'],
  ['swedish', 'SE'], ['dutch', 'NL'], ['japanese', 'JP'], ['australian', 'AU'], ['canadian', 'CA'],
  ['spanish', 'ES'], ['italian', 'IT'], ['swiss', 'CH'], ['luxembourg', 'LU'], ['belgian', 'BE'], ['danish', 'DK'],
  ['norwegian', 'NO'], ['finnish', 'FI'], ['austrian', 'AT'], ['polish', 'PL'], ['portuguese', 'PT'],
  ['singaporean', 'SG'], ['singapore', 'SG'], ['new zealand', 'NZ'], ['cayman islands', 'KY'], ['indian', 'IN'],
  ['brazilian', 'BR'], ['mexican', 'MX'], ['chinese', 'CN'], ['korean', 'KR'],
];

/** Phrases in other languages naming the governing law of incorporation. */
export const FOREIGN_PHRASES: ReadonlyArray<[string, string]> = [
  ['de droit français', 'FR'], ['de droit francais', 'FR'], ['nach deutschem recht', 'DE'],
  ['deutschen rechts', 'DE'], ['di diritto italiano', 'IT'], ['de nacionalidad española', 'ES'],
  ['de nacionalidad espanola', 'ES'], ['sociedad española', 'ES'], ['de droit luxembourgeois', 'LU'],
  ['de droit belge', 'BE'], ['de droit suisse', 'CH'], ['nach schweizer recht', 'CH'],
  ['naar nederlands recht', 'NL'], ['svensk', 'SE'],
];
