/**
 * Invented given names of the persons in generated data (signers, individual counterparties); their surnames are
 * coined (coined-words.ts).
 */

/** Invented given names and surnames for signers and individual counterparties (surnames are coined). */
export const GIVEN_NAMES = [
  'Maren',
  'Tobias',
  'Ilse',
  'Hugo',
  'Clara',
  'Anton',
  'Sofie',
  'Elias',
  'Nadia',
  'Oskar',
  'Greta',
  'Luca',
  'Amara',
  'Jonas',
  'Pia',
  'Felix',
  'Ines',
  'Ravi',
  'Yuki',
  'Kenji',
  'Aiko',
  'Priya',
  'Mateo',
  'Lena',
  'Owen',
  'Freya',
  'Tomas',
  'Elena',
  'Marcus',
  'Hanna',
] as const;
