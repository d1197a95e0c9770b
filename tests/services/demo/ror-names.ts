/**
 * The lower-cased names of ../shared/datasets/ror_org_names.csv (real research organisations, README there): the
 * tests check that no invented name is one of them.
 */
import { readFileSync } from 'node:fs';

export function rorNames(): Set<string> {
  return new Set(
    readFileSync(new URL('../../../../shared/datasets/ror_org_names.csv', import.meta.url), 'utf8')
      .split('\n')
      .slice(1)
      .map((line) => (line.split(',')[1] ?? '').toLowerCase()),
  );
}
