/**
 * UK required indications, Companies Act 2006 Part 5 (ss. 58–59): a private limited company ends its name
 * with "limited" or "ltd." (Welsh "cyfyngedig" / "cyf."), a public company with "public limited company" or
 * "p.l.c." (Welsh "cwmni cyfyngedig cyhoeddus" / "c.c.c."). Each set is one family for matching.
 * ELF v1.5: H0PO (Ltd;Ltd.;Limited / cyf;cyf.), B6ES (PLC;P.L.C;plc;p.l.c / CCC;C.C.C.).
 */
import { describe, expect, it } from 'vitest';
import { analyseName, legalFormFamily } from '../../../resolvers/analyse/index.ts';

const PRIVATE = ['Limited', 'LIMITED', 'Ltd', 'Ltd.', 'LTD.', 'Cyfyngedig', 'Cyf', 'cyf.']; // CA 2006 s.59; ELF H0PO
const PUBLIC = ['public limited company', 'Public Limited Company', 'PLC', 'plc', 'p.l.c.', 'P.L.C.', 'Cwmni Cyfyngedig Cyhoeddus', 'C.C.C.']; // CA 2006 s.58; ELF B6ES

describe('UK required indications (Companies Act 2006 Part 5)', () => {
  it('private limited company indications are one family and stand for H0PO in GB', () => {
    for (const ending of PRIVATE) {
      const a = analyseName(`Tarrow Vale Joinery ${ending}`, { country: 'GB' });
      expect(a.legalForm?.family, ending).toBe('ltd');
      expect(a.legalForm?.elfCodes, ending).toContain('H0PO');
      expect(a.core, ending).toBe('tarrow vale joinery');
    }
  });

  it('public limited company indications are one family and stand for B6ES in GB', () => {
    for (const ending of PUBLIC) {
      const a = analyseName(`Tarrow Vale Holdings ${ending}`, { country: 'GB' });
      expect(a.legalForm?.family, ending).toBe('plc');
      expect(a.legalForm?.elfCodes, ending).toContain('B6ES');
      expect(a.core, ending).toBe('tarrow vale holdings');
    }
  });

  it('the two families differ', () => {
    expect(legalFormFamily('Ltd')).not.toBe(legalFormFamily('plc'));
  });
});
