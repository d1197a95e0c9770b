/**
 * Party names broken across lines, as a hard-wrapped .txt or text extracted from a PDF breaks them: each is one
 * name, with one space where the line broke, and the same party as the name written on one line. Expected values
 * are the names as a reader of these invented passages reads them (common practice: a line break inside a name in
 * running text is a space).
 */
import { describe, expect, it } from 'vitest';
import { parseParties } from '../../../resolvers/terms/index.ts';
import { oneLine } from '../../../resolvers/terms/parse-parties.ts';

const names = (text: string): [string, string | null][] => parseParties(text).parties.map((p) => [p.name, p.role]);

describe('party names broken across lines', () => {
  it('reads a name wrapped inside a "between … and …" parties clause as one name', () => {
    const text = [
      'SUPPLY AGREEMENT',
      '',
      'This Agreement is made between Brackenfold Coatings',
      'Limited, a company incorporated in England (the "Supplier"), and Tessaline Trading',
      'GmbH (the "Customer").',
    ].join('\n');
    expect(names(text)).toEqual([
      ['Brackenfold Coatings Limited', 'Supplier'],
      ['Tessaline Trading GmbH', 'Customer'],
    ]);
  });

  it('reads numbered party items wrapped with indentation and Windows line ends as one name each', () => {
    const text =
      'PARTIES\r\n\r\n(1)  Brackenfold Coatings\r\n     Limited, a company registered in England ("Supplier"); and\r\n(2)  Quillmoor\r\n     Fabrication Ltd ("Customer").\r\n';
    expect(names(text)).toEqual([
      ['Brackenfold Coatings Limited', 'Supplier'],
      ['Quillmoor Fabrication Ltd', 'Customer'],
    ]);
  });

  it('gives the wrapped and the one-line text the same parties, and collective terms name them the same way', () => {
    const flat =
      'This Agreement is made between Orrinford Marine Services Ltd (the "Contractor") and Vellacourt Instruments GmbH (the "Client") (together, the "Parties").';
    const wrapped =
      'This Agreement is made between Orrinford Marine\nServices Ltd (the "Contractor") and Vellacourt\n  Instruments GmbH (the "Client") (together, the "Parties").';
    const a = parseParties(flat);
    const b = parseParties(wrapped);
    expect(b.parties.map((p) => [p.name, p.role, p.jurisdiction ?? null])).toEqual(a.parties.map((p) => [p.name, p.role, p.jurisdiction ?? null]));
    expect(b.collectiveTerms).toEqual(a.collectiveTerms);
    expect(b.parties.length).toBe(2);
  });

  it('keeps spaces within a line as written and changes nothing in a name on one line', () => {
    expect(oneLine('Brackenfold Coatings\nLimited')).toBe('Brackenfold Coatings Limited');
    expect(oneLine('Brackenfold Coatings  \r\n\t Limited')).toBe('Brackenfold Coatings Limited');
    expect(oneLine('Brackenfold  Coatings Limited')).toBe('Brackenfold  Coatings Limited');
  });
});
