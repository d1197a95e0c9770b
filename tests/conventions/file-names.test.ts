/**
 * One file-naming convention: tracked source files are kebab-case (`analyse-name.ts`, `jaro-winkler.test.ts`) and a
 * folder's test helpers are its support.ts. Landed migrations keep their timestamp names. To fix a failure, run
 * `node bin/run-ts.js scripts/rename-to-kebab.ts` (it renames with git mv and rewrites every reference).
 */
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { kebabFileName, plannedRenames, rewriteReferences } from '../../scripts/kebab-names.ts';

describe('file names', () => {
  it('spells a name in kebab-case part by part (examples written for this test)', () => {
    expect(kebabFileName('analyseName.ts')).toBe('analyse-name.ts');
    expect(kebabFileName('jaroWinkler.test.ts')).toBe('jaro-winkler.test.ts');
    expect(kebabFileName('softTfIdf.ts')).toBe('soft-tf-idf.ts');
    expect(kebabFileName('parseJSONFile.ts')).toBe('parse-json-file.ts');
    expect(kebabFileName('mod97.ts')).toBe('mod97.ts');
    expect(kebabFileName('change-set.ts')).toBe('change-set.ts');
  });

  it('rewrites imports, repository paths and bare names of a renamed file, and nothing else', () => {
    const plan = new Map([
      ['resolvers/compare/jaroWinkler.ts', 'resolvers/compare/jaro-winkler.ts'],
      ['tests/services/api/v1-support.ts', 'tests/services/api/support.ts'],
    ]);
    const source = [
      "import { jaro } from '../../../resolvers/compare/jaroWinkler.ts';",
      "import { app } from './v1-support.ts';",
      "import { other } from './v1-other.ts';",
      '// see resolvers/compare/jaroWinkler.ts and jaroWinkler.ts; jaroWinkler stays a function name',
    ].join('\n');
    expect(rewriteReferences(source, 'tests/services/api/x.test.ts', 'tests/services/api/x.test.ts', plan)).toBe(
      [
        "import { jaro } from '../../../resolvers/compare/jaro-winkler.ts';",
        "import { app } from './support.ts';",
        "import { other } from './v1-other.ts';",
        '// see resolvers/compare/jaro-winkler.ts and jaro-winkler.ts; jaroWinkler stays a function name',
      ].join('\n'),
    );
  });

  it('every tracked source file follows the convention (nothing left to rename)', () => {
    const files = execFileSync('git', ['ls-files', '-z'], { encoding: 'utf8' }).split('\0').filter(Boolean);
    expect([...plannedRenames(files)].map(([from, to]) => `${from} -> ${to}`)).toEqual([]);
  });
});
