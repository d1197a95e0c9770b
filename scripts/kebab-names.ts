/**
 * The naming convention of tracked source files (kebab-case, test helpers in support.ts) and how a rename rewrites
 * the references to a file: the pure part of scripts/rename-to-kebab.ts, used by tests/conventions/file-names.test.ts.
 */
import { posix } from 'node:path';

export const SOURCE = /\.(?:ts|js|mjs|cjs)$/;
export const SKIP = [/^migrations\//, /^node_modules\//];
/** Test helper modules under another name than their folder's support.ts (see tests/conventions/test-support.test.ts). */
const SUPPORT_RENAMES: Record<string, string> = {
  'tests/services/api/v1-support.ts': 'tests/services/api/support.ts',
  'tests/services/register/helpers.ts': 'tests/services/register/support.ts',
};
/** Text files whose references are rewritten (everything tracked that is not binary or data). */
export const TEXT = /\.(?:ts|js|mjs|cjs|json|md|yml|yaml|html|css|sh)$|^\.prettierignore$|(?:^|\/)\.prettierignore$|(?:^|\/)Dockerfile$/;
/** Files that spell old names on purpose (the rename plan and its tests): never rewritten. */
export const NO_REWRITE: readonly string[] = ['scripts/kebab-names.ts', 'scripts/rename-to-kebab.ts', 'tests/conventions/file-names.test.ts'];
export const DATA = [/^data\//, /^tests\/fixtures\/.*\.(?:json|csv|ndjson)$/, /^resolvers\/analyse\/elf-table\.json$/, /^package-lock\.json$/];

/** `analyseName.test.ts` → `analyse-name.test.ts`: each dot-separated part of the name in kebab-case. */
export function kebabFileName(name: string): string {
  return name
    .split('.')
    .map((part) =>
      part
        .replace(/([a-z0-9])([A-Z])/g, '$1-$2')
        .replace(/([A-Z])(?=[A-Z][a-z])/g, '$1-')
        .toLowerCase(),
    )
    .join('.');
}

/** Old path → new path for every file that needs renaming (an empty map when the tree already follows the convention). */
export function plannedRenames(files: readonly string[]): Map<string, string> {
  const plan = new Map<string, string>();
  for (const file of files) {
    if (!SOURCE.test(file) || SKIP.some((p) => p.test(file))) continue;
    const name = posix.basename(file);
    const kebab = kebabFileName(name);
    if (kebab !== name) plan.set(file, posix.join(posix.dirname(file), kebab));
  }
  for (const [from, to] of Object.entries(SUPPORT_RENAMES)) {
    const current = plan.get(from) ?? from;
    if (files.includes(from)) plan.set(from, current === from ? to : current);
  }
  const targets = new Set<string>();
  for (const [from, to] of plan) {
    if (targets.has(to) || (files.includes(to) && !plan.has(to))) throw new Error(`renaming ${from} to ${to} would overwrite another file`);
    targets.add(to);
  }
  return plan;
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** A text with its references to renamed files rewritten; `file` is the text's own path after the renames. */
export function rewriteReferences(text: string, file: string, oldFile: string, plan: Map<string, string>): string {
  // Relative specifiers (imports, new URL(…)): resolved against the file, so only those naming a renamed file change.
  // Renames never change a file's folder, so specifiers of the renamed files themselves stay valid otherwise.
  let out = text.replace(/(['"`])(\.\.?\/[^'"`\s]+)\1/g, (whole, quote: string, spec: string) => {
    const moved = plan.get(posix.normalize(posix.join(posix.dirname(oldFile), spec)));
    if (!moved) return whole;
    const next = posix.relative(posix.dirname(file), moved);
    return `${quote}${next.startsWith('.') ? next : `./${next}`}${quote}`;
  });
  for (const [from, to] of plan) {
    // Repository paths (in scripts, docs and comments).
    out = out.replace(new RegExp(`(?<![\\w./-])${escapeRegExp(from)}(?![\\w-])`, 'g'), to);
    // Bare file names ("see jaroWinkler.ts", markdown links): camelCase names and -support names are distinctive
    // enough to rewrite everywhere; a plain `helpers.ts` is rewritten only through its imports and paths.
    const oldName = posix.basename(from);
    if (/[A-Z]|-support\./.test(oldName)) out = out.replace(new RegExp(`(?<![\\w.-])${escapeRegExp(oldName)}(?![\\w-])`, 'g'), posix.basename(to));
  }
  return out;
}
