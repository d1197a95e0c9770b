/**
 * The short forms of a person's name that erasure looks for in unlinked mentions (services/forget/person-mentions.ts):
 * initial and surname either way round, given name and surname either way round, titles and punctuation ignored.
 * Names are invented.
 */
import { expect, it } from 'vitest';
import { nameTokens, shortForms } from '../../../services/forget/person-mentions.ts';

it('finds "B. Quenneville", "Quenneville, B." and "Dr Bartholomew Quenneville" as forms of Bartholomew Quenneville', () => {
  const { forms, surname } = shortForms('Bartholomew Quenneville');
  expect(surname).toBe('quenneville');
  for (const text of ['B. Quenneville', 'Quenneville, B.', 'Dr Bartholomew Quenneville', 'QUENNEVILLE Bartholomew', 'Mr. B Quenneville'])
    expect(forms.has(nameTokens(text).join(' ')), text).toBe(true);
  // Another initial, another surname, or more words (a company) are not the person.
  for (const text of ['C. Quenneville', 'B. Quennevale', 'Quenneville Freight Ltd', 'Quenneville'])
    expect(forms.has(nameTokens(text).join(' ')), text).toBe(false);
});

it('folds accents, and gives no forms for a one-word name or a surname under three letters', () => {
  expect(shortForms('Élodie Bréval').forms.has(nameTokens('E. Breval').join(' '))).toBe(true);
  expect(shortForms('Quenneville').forms.size).toBe(0);
  expect(shortForms('Anh Vo').forms.size).toBe(0);
});
