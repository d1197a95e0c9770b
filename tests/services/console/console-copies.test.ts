/**
 * The console is plain JavaScript served as it is (no build step), so it cannot import the server's TypeScript
 * constants: where a page keeps a copy of one, this test reads the page and checks the copy against the constant.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { MAX_ID_LENGTH } from '../../../resolvers/vocabulary.ts';
import { REJECT_REASON_CODES } from '../../../resolvers/files/index.ts';

const importPage = readFileSync(new URL('../../../services/console/static/pages/import.js', import.meta.url), 'utf8');

describe("the console's copies of server values", () => {
  it('holds the import source to the id limit of the register', () => {
    const copy = /^const MAX_ID_LENGTH = (\d+);$/m.exec(importPage);
    expect(copy, 'services/console/static/pages/import.js declares MAX_ID_LENGTH').not.toBeNull();
    expect(Number(copy![1])).toBe(MAX_ID_LENGTH);
    expect(importPage).toContain('maxlength: String(MAX_ID_LENGTH)');
  });

  it('has words for every reason a file is not imported', () => {
    const block = /const REASON_WORDS = \{([^}]*)\};/.exec(importPage);
    expect(block, 'services/console/static/pages/import.js declares REASON_WORDS').not.toBeNull();
    const codes = block![1]!.split('\n').flatMap((line) => /^ *([a-z_]+):/.exec(line)?.[1] ?? []);
    expect(codes.sort()).toEqual([...REJECT_REASON_CODES].sort());
  });
});
