/**
 * Word material for invented organisation and person names. Every name is coined from syllables, so the
 * generators never reproduce a real company or person on purpose; descriptor and industry words are
 * ordinary dictionary words.
 */

/** Onsets and codas of coined name words (pronounceable in English, Germanic and Romance languages). */
export const SYLLABLES = [
  'bra', 'cor', 'dal', 'fen', 'gar', 'hal', 'kes', 'lan', 'mar', 'nor', 'pel', 'quil', 'ros', 'sel', 'tor', 'val',
  'wen', 'ald', 'bel', 'cal', 'dun', 'elm', 'fal', 'gren', 'holt', 'ind', 'jas', 'kel', 'lor', 'mel', 'nat', 'orv',
  'pra', 'ren', 'sta', 'tam', 'ulv', 'ver', 'wil', 'yar', 'zan', 'bro', 'cas', 'dre', 'fro', 'gil', 'hav', 'kin',
  'lud', 'mor', 'ost', 'per', 'ral', 'sor', 'tre', 'ven', 'win', 'ard', 'ber', 'cen', 'dov', 'esk', 'fir', 'han',
] as const;

/** Word endings that make a coined word read like a place or family name. */
export const ENDINGS = [
  'dale', 'ford', 'wick', 'ton', 'berg', 'mere', 'ham', 'by', 'stead', 'field', 'more', 'ley', 'worth', 'ridge',
  'brook', 'holm', 'ia', 'ora', 'ex', 'is', 'an', 'ell', 'ico', 'ara', 'ova', 'und', 'ing', 'ard', 'ine', 'ax',
  'oni', 'ette',
] as const;

/** Activity words: the part of a name that says what the company does. */
export const INDUSTRIES = [
  'Fabrication', 'Logistics', 'Systems', 'Analytics', 'Engineering', 'Foods', 'Textiles', 'Marine', 'Software',
  'Consulting', 'Components', 'Instruments', 'Packaging', 'Pharmaceuticals', 'Energy', 'Freight', 'Robotics',
  'Materials', 'Optics', 'Media', 'Holdings', 'Capital', 'Partners', 'Industries', 'Technologies', 'Services',
  'Solutions', 'Labs', 'Biosciences', 'Construction', 'Electronics', 'Chemicals', 'Mining', 'Metals', 'Plastics',
  'Printing', 'Security', 'Telecom', 'Aviation', 'Rail Components', 'Water Systems', 'Data Services',
  'Medical Devices', 'Facility Services', 'Fire Protection', 'Hydraulics', 'Ceramics', 'Coatings', 'Agritech',
  'Furniture', 'Glassworks', 'Insurance Brokers', 'Translations', 'Recruitment', 'Catering', 'Cleaning Services',
  'Print & Design', 'Timber', 'Seeds', 'Dairy', 'Power Tools', 'Precision Parts', 'Trading', 'Research',
] as const;

/** Activity words in the local language, used for some names in these countries (none is in INDUSTRIES). */
export const LOCAL_INDUSTRIES: Readonly<Record<string, readonly string[]>> = {
  DE: ['Präzisionstechnik', 'Fördertechnik', 'Maschinenbau', 'Gerätebau', 'Süßwaren', 'Logistik', 'Baustoffe', 'Messtechnik'],
  FR: ['Équipements', 'Matériaux', 'Électronique', 'Frères', 'Bâtiment', 'Télécom', 'Énergie', 'Imprimerie'],
  NL: ['Techniek', 'Handel', 'Bouw', 'Transport', 'Verpakking', 'Installatie', 'Scheepvaart', 'Zuivel'],
  SE: ['Verktyg', 'Skogsprodukter', 'Ståltjänst', 'Byggnad', 'Mekaniska', 'Elektriska', 'Frakt', 'Läkemedel'],
  ES: ['Construcciones', 'Ingeniería', 'Transportes', 'Alimentación', 'Maquinaria', 'Energía', 'Química', 'Papelera'],
  IT: ['Meccanica', 'Tessile', 'Costruzioni', 'Impianti', 'Alimentari', 'Elettronica', 'Trasporti', 'Grafica'],
  JP: ['Shoji', 'Kogyo', 'Seiki', 'Denki', 'Kensetsu', 'Butsuryu', 'Seiyaku', 'Tsusho'],
};

/** Optional middle words. */
export const DESCRIPTORS = [
  'North', 'Pacific', 'Atlantic', 'United', 'International', 'Global', 'Advanced', 'Applied', 'First', 'Summit',
  'Blue', 'Green', 'Silver', 'Northern', 'Western', 'Coastal', 'Metro', 'Royal', 'Central', 'Eastern',
] as const;

/** Invented given names and surnames for signers and individual counterparties (surnames are coined). */
export const GIVEN_NAMES = [
  'Maren', 'Tobias', 'Ilse', 'Hugo', 'Clara', 'Anton', 'Sofie', 'Elias', 'Nadia', 'Oskar', 'Greta', 'Luca', 'Amara',
  'Jonas', 'Pia', 'Felix', 'Ines', 'Ravi', 'Yuki', 'Kenji', 'Aiko', 'Priya', 'Mateo', 'Lena', 'Owen', 'Freya',
  'Tomas', 'Elena', 'Marcus', 'Hanna',
] as const;

/** Legal forms per country: the canonical spelling first, then ways people write the same form. */
export interface LegalFormFamily {
  canonical: string;
  variants: readonly string[];
}

export const LEGAL_FORMS: Readonly<Record<string, readonly LegalFormFamily[]>> = {
  US: [
    { canonical: 'Inc.', variants: ['Inc', 'Incorporated', 'INC.', 'inc.'] },
    { canonical: 'LLC', variants: ['L.L.C.', 'Limited Liability Company', 'llc', 'L.L.C'] },
    { canonical: 'Corp.', variants: ['Corporation', 'Corp', 'CORP.'] },
    { canonical: 'L.P.', variants: ['LP', 'Limited Partnership'] },
  ],
  GB: [
    { canonical: 'Ltd', variants: ['Limited', 'Ltd.', 'LTD', 'ltd'] },
    { canonical: 'plc', variants: ['PLC', 'Public Limited Company', 'p.l.c.'] },
    { canonical: 'LLP', variants: ['L.L.P.', 'Limited Liability Partnership'] },
  ],
  DE: [
    { canonical: 'GmbH', variants: ['G.m.b.H.', 'Gesellschaft mit beschränkter Haftung', 'Gmbh', 'GMBH'] },
    { canonical: 'AG', variants: ['Aktiengesellschaft', 'A.G.'] },
    { canonical: 'GmbH & Co. KG', variants: ['GmbH & Co KG', 'GmbH u. Co. KG', 'GmbH and Co. KG'] },
  ],
  FR: [
    { canonical: 'SAS', variants: ['S.A.S.', 'Société par actions simplifiée', 'S.A.S'] },
    { canonical: 'SA', variants: ['S.A.', 'Société anonyme'] },
    { canonical: 'SARL', variants: ['S.A.R.L.', 'Société à responsabilité limitée', 'Sarl'] },
  ],
  NL: [
    { canonical: 'B.V.', variants: ['BV', 'Besloten Vennootschap', 'B.V', 'bv'] },
    { canonical: 'N.V.', variants: ['NV', 'Naamloze Vennootschap'] },
  ],
  JP: [
    { canonical: 'K.K.', variants: ['Kabushiki Kaisha', 'KK', 'Co., Ltd.'] },
    { canonical: 'G.K.', variants: ['Godo Kaisha', 'GK'] },
  ],
  AU: [
    { canonical: 'Pty Ltd', variants: ['Pty. Ltd.', 'Proprietary Limited', 'PTY LTD', 'Pty Limited'] },
    { canonical: 'Ltd', variants: ['Limited', 'Ltd.'] },
  ],
  SE: [{ canonical: 'AB', variants: ['Aktiebolag', 'Aktiebolaget', 'A.B.'] }],
  IT: [
    { canonical: 'S.r.l.', variants: ['Srl', 'SRL', 'Società a responsabilità limitata'] },
    { canonical: 'S.p.A.', variants: ['SpA', 'SPA'] },
  ],
  ES: [
    { canonical: 'S.L.', variants: ['SL', 'Sociedad Limitada'] },
    { canonical: 'S.A.', variants: ['SA', 'Sociedad Anónima'] },
  ],
};

/** Jurisdictions used by the generators (ISO 3166-1 alpha-2, US states as ISO 3166-2), with weights. */
export const JURISDICTIONS: ReadonlyArray<{ code: string; weight: number }> = [
  { code: 'US-DE', weight: 14 },
  { code: 'US-CA', weight: 6 },
  { code: 'US-NY', weight: 5 },
  { code: 'US-TX', weight: 4 },
  { code: 'GB', weight: 14 },
  { code: 'DE', weight: 12 },
  { code: 'FR', weight: 9 },
  { code: 'NL', weight: 7 },
  { code: 'JP', weight: 6 },
  { code: 'AU', weight: 6 },
  { code: 'SE', weight: 3 },
  { code: 'IT', weight: 4 },
  { code: 'ES', weight: 4 },
];

/** The legal-form table's key for a jurisdiction ("US-DE" → "US"). */
export function countryOf(jurisdiction: string): string {
  return jurisdiction.slice(0, 2);
}
