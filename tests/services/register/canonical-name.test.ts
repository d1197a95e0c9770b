/** The canonical-value rules (docs/register.md) on hand-made name lists; every expectation follows a written rule. */
import { describe, expect, it } from 'vitest';
import { chooseCanonicalName, type NameCandidate } from '../../../services/register/index.ts';

const name = (id: number, text: string, extra: Partial<NameCandidate> = {}): NameCandidate => ({
  id,
  name: text,
  kind: 'observed',
  legal_form: null,
  seen_count: 1,
  confirmed_by: null,
  ...extra,
});

describe('canonical-value rules', () => {
  it('rule 1: a name confirmed by a person or a strong identifier wins over a more frequent one', () => {
    const chosen = chooseCanonicalName([
      name(1, 'Fernhill Dairies Limited', { kind: 'legal', legal_form: 'ltd', seen_count: 9 }),
      name(2, 'Fernhill Dairies Ltd', { kind: 'legal', legal_form: 'ltd', confirmed_by: 'identifier:lei' }),
    ]);
    expect(chosen?.id).toBe(2);
  });
  it('rule 2: the most frequent full legal name with its legal form, before a longer name without one', () => {
    const chosen = chooseCanonicalName([
      name(1, 'Fernhill Dairies Ltd', { legal_form: 'ltd', seen_count: 3 }),
      name(2, 'Fernhill Dairies Limited', { legal_form: 'ltd', seen_count: 2 }),
      name(3, 'Fernhill Dairies of the Northern Counties'),
    ]);
    expect(chosen?.id).toBe(1);
  });
  it('rule 3: otherwise the longest; former names only when nothing else is left; ties go to the oldest', () => {
    expect(chooseCanonicalName([name(1, 'Fernhill'), name(2, 'Fernhill Dairies')])?.id).toBe(2);
    expect(chooseCanonicalName([name(1, 'Fernhill Creamery Company Limited', { kind: 'former', legal_form: 'ltd' }), name(2, 'Fernhill')])?.id).toBe(2);
    expect(chooseCanonicalName([name(5, 'Fernhill Dairies'), name(4, 'Fernhill Dairiez')])?.id).toBe(4);
    expect(chooseCanonicalName([name(1, 'Old Fernhill', { kind: 'former' })])?.id).toBe(1);
    expect(chooseCanonicalName([])).toBeUndefined();
  });
});
