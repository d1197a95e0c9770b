/**
 * Renames every tracked source file to the one naming convention (kebab-case: `analyse-name.ts`,
 * `jaro-winkler.test.ts`) and each folder's test helpers to `support.ts`, with `git mv`, then rewrites every
 * reference to a renamed file: relative import and URL specifiers (resolved, so only the files that point at the
 * renamed one change), repository paths (`resolvers/score/defaultModel.ts`) and bare file names in comments and
 * docs (`see jaroWinkler.ts`). Idempotent: a second run finds nothing to rename and changes nothing.
 *
 *   node bin/run-ts.js scripts/rename-to-kebab.ts [--dry-run]
 *
 * Landed migrations keep their timestamp names (never edited). tests/conventions/file-names.test.ts checks the result.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { DATA, NO_REWRITE, TEXT, plannedRenames, rewriteReferences } from './kebab-names.ts';

function git(args: string[]): string {
  return execFileSync('git', args, { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
}

function trackedFiles(): string[] {
  return git(['ls-files', '-z']).split('\0').filter(Boolean);
}

function main(): void {
  const dryRun = process.argv.includes('--dry-run');
  const root = git(['rev-parse', '--show-toplevel']).trim();
  process.chdir(root);
  const files = trackedFiles();
  const plan = plannedRenames(files);
  if (plan.size === 0) {
    console.log('every tracked source file is already kebab-case: nothing to rename');
    return;
  }
  for (const [from, to] of plan) console.log(`${from} -> ${to}`);
  if (dryRun) return;
  for (const [from, to] of plan) git(['mv', from, to]);
  const newOf = (f: string): string => plan.get(f) ?? f;
  let rewritten = 0;
  for (const oldFile of files) {
    const file = newOf(oldFile);
    if (!TEXT.test(file) || DATA.some((p) => p.test(file)) || NO_REWRITE.includes(file) || !existsSync(file)) continue;
    const text = readFileSync(file, 'utf8');
    const next = rewriteReferences(text, file, oldFile, plan);
    if (next !== text) {
      writeFileSync(file, next);
      rewritten++;
    }
  }
  console.log(`${plan.size} files renamed, references rewritten in ${rewritten} files`);
}

main();
