/** Invented contacts of the demo scenario: coined words, people, signers, addresses and phone numbers. */
import type { Random } from '../../../resolvers/prng.ts';
import { ENDINGS, GIVEN_NAMES, SYLLABLES, countryOf } from '../name-parts.ts';
import { CITIES, SIGNER_TITLES, STREET_WORDS, SURNAME_ENDINGS } from './contact-data.ts';
import * as ids from './identifiers.ts';
import type { Address, Person } from './types.ts';

export function coinedWord(rnd: Random): string {
  const w = rnd.pick(SYLLABLES) + rnd.pick(SYLLABLES) + rnd.pick(ENDINGS);
  return w[0]!.toUpperCase() + w.slice(1);
}

function surname(rnd: Random): string {
  const w = rnd.pick(SYLLABLES) + rnd.pick(SURNAME_ENDINGS);
  return w[0]!.toUpperCase() + w.slice(1);
}

export function personName(rnd: Random): string {
  return `${rnd.pick(GIVEN_NAMES)} ${surname(rnd)}`;
}

export function signers(rnd: Random, n: number): Person[] {
  return Array.from({ length: n }, () => ({ name: personName(rnd), title: rnd.pick(SIGNER_TITLES) }));
}

export function address(rnd: Random, jurisdiction: string): Address {
  const country = countryOf(jurisdiction);
  const [city, postal] = rnd.pick(CITIES[jurisdiction] ?? CITIES[country]!);
  const word = rnd.pick(STREET_WORDS[country] ?? ['Street']);
  const coined = coinedWord(rnd);
  const no = String(1 + rnd.int(240));
  let street: string;
  if (country === 'DE' || country === 'NL' || country === 'SE') street = `${coined}${word} ${no}`;
  else if (country === 'FR' || country === 'IT' || country === 'ES') street = `${no} ${word} ${coined}`;
  else if (country === 'JP') street = `${1 + rnd.int(9)}-${1 + rnd.int(20)}-${1 + rnd.int(30)} ${coined}`;
  else street = `${no} ${coined} ${word}`;
  return { street, city, postalCode: postal, country };
}

export function formatAddress(a: Address): string {
  if (a.country === 'US') return `${a.street}, ${a.city}, ${a.postalCode}`;
  if (['GB', 'AU', 'JP'].includes(a.country)) return `${a.street}, ${a.city} ${a.postalCode}`;
  return `${a.street}, ${a.postalCode} ${a.city}`;
}

/** Phone numbers; where a country reserves numbers for fiction (US 555-01xx, UK 020 7946 0xxx, AU 0491 570 xxx) they are used. */
export function phone(rnd: Random, jurisdiction: string): string {
  const c = countryOf(jurisdiction);
  const d = (n: number): string => ids.digits(rnd, n);
  switch (c) {
    case 'US':
      return `+1 ${rnd.pick(['302', '408', '518', '512', '212', '713'])} 555 01${d(2)}`;
    case 'GB':
      return `+44 20 7946 0${d(3)}`;
    case 'AU':
      return `+61 491 570 ${rnd.pick(['006', '156', '157', '158', '159', '110', '313', '737', '938'])}`;
    case 'DE':
      return `+49 40 ${d(7)}`;
    case 'FR':
      return `+33 1 ${d(2)} ${d(2)} ${d(2)} ${d(2)}`;
    case 'NL':
      return `+31 20 ${d(3)} ${d(4)}`;
    case 'JP':
      return `+81 6 ${d(4)} ${d(4)}`;
    case 'SE':
      return `+46 31 ${d(3)} ${d(2)} ${d(2)}`;
    case 'IT':
      return `+39 011 ${d(7)}`;
    default:
      return `+34 96 ${d(3)} ${d(4)}`;
  }
}
