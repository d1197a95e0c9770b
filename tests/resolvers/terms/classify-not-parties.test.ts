/** Non-parties grouped by why they were left out, for `cpreg contract parse` (issue 16). Invented names. */
import { describe, expect, it } from 'vitest';
import { classifyNotParties } from '../../../resolvers/terms/index.ts';

describe('classifyNotParties', () => {
  it('puts places, document references and roles apart from the rest', () => {
    const groups = classifyNotParties([
      'Agreement',
      'Effective Date',
      'the State of New York',
      'England and Wales',
      'Sub-processor',
      'Customer',
      'Oswin Tarrant',
      'Schedule 2',
    ]);
    expect(groups).toEqual({
      places: ['the State of New York', 'England and Wales'],
      documents: ['Agreement', 'Effective Date', 'Schedule 2'],
      roles: ['Sub-processor', 'Customer'],
      other: ['Oswin Tarrant'],
    });
  });
});
