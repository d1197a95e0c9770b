/**
 * The tables the demo scenario's invented contacts are drawn from (services/demo/scenario/contacts.ts): towns with
 * their postal codes per jurisdiction, street words per country, the endings of invented surnames, signers' titles.
 * Real towns and the postal code forms of their countries (common practice); no real address is made from them.
 */

/** Towns and a postal code of each, per jurisdiction (a US state or a country). */
export const CITIES: Readonly<Record<string, ReadonlyArray<readonly [string, string]>>> = {
  'US-DE': [
    ['Wilmington', 'DE 19801'],
    ['Dover', 'DE 19901'],
    ['Newark', 'DE 19711'],
  ],
  'US-CA': [
    ['San Jose', 'CA 95113'],
    ['Sacramento', 'CA 95814'],
    ['Oakland', 'CA 94612'],
  ],
  'US-NY': [
    ['Albany', 'NY 12207'],
    ['Buffalo', 'NY 14202'],
    ['Rochester', 'NY 14604'],
  ],
  'US-TX': [
    ['Austin', 'TX 78701'],
    ['Houston', 'TX 77002'],
    ['Dallas', 'TX 75201'],
  ],
  GB: [
    ['Leeds', 'LS1 4AP'],
    ['Bristol', 'BS1 5TR'],
    ['Manchester', 'M2 3WQ'],
    ['London', 'EC2A 4NE'],
  ],
  DE: [
    ['Hamburg', '20095'],
    ['Köln', '50667'],
    ['Stuttgart', '70173'],
    ['München', '80331'],
  ],
  FR: [
    ['Lyon', '69002'],
    ['Nantes', '44000'],
    ['Lille', '59000'],
    ['Paris', '75009'],
  ],
  NL: [
    ['Utrecht', '3511 AB'],
    ['Eindhoven', '5611 AZ'],
    ['Rotterdam', '3011 AD'],
  ],
  JP: [
    ['Osaka', '530-0001'],
    ['Nagoya', '450-0002'],
    ['Tokyo', '100-0005'],
  ],
  AU: [
    ['Brisbane', 'QLD 4000'],
    ['Perth', 'WA 6000'],
    ['Melbourne', 'VIC 3000'],
  ],
  SE: [
    ['Göteborg', '411 03'],
    ['Malmö', '211 20'],
    ['Uppsala', '753 20'],
  ],
  IT: [
    ['Torino', '10121'],
    ['Bologna', '40121'],
    ['Milano', '20121'],
  ],
  ES: [
    ['Valencia', '46002'],
    ['Zaragoza', '50001'],
    ['Sevilla', '41001'],
  ],
};

/** Words a street name ends or starts with, per country. */
export const STREET_WORDS: Readonly<Record<string, readonly string[]>> = {
  US: ['Avenue', 'Street', 'Boulevard', 'Parkway'],
  GB: ['Road', 'Street', 'Lane', 'Wharf'],
  AU: ['Street', 'Road', 'Parade'],
  DE: ['straße', 'weg', 'allee'],
  FR: ['rue', 'avenue', 'quai'],
  NL: ['straat', 'laan', 'kade'],
  SE: ['gatan', 'vägen'],
  IT: ['via', 'corso'],
  ES: ['calle', 'avenida'],
  JP: ['chome'],
};

/** Endings of invented surnames (a syllable is put before one). */
export const SURNAME_ENDINGS: readonly string[] = ['by', 'dale', 'ford', 'wick', 'holm', 'stead', 'ley', 'mere', 'berg', 'sson'];

/** The titles a signer of a contract holds. */
export const SIGNER_TITLES: readonly string[] = [
  'Chief Executive Officer',
  'Director',
  'Managing Director',
  'General Counsel',
  'Head of Procurement',
  'Chief Financial Officer',
  'Vice President, Operations',
  'Company Secretary',
];
