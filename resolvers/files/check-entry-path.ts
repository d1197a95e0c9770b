/**
 * Whether an archive entry's path stays inside the archive: a path that is absolute ("/etc/x", "C:/x", "//host"),
 * climbs out ("..", "a/../../b"), or holds a NUL or control character is refused (the "zip slip" kinds of entry).
 * Backslashes count as separators, as Windows tools write them. A safe path comes back normalised: "/" separators,
 * no "." or empty segments.
 */
export type EntryPathCheck = { ok: true; path: string } | { ok: false; problem: string };

export function checkEntryPath(name: string): EntryPathCheck {
  if (name.length === 0) return { ok: false, problem: 'the entry has an empty name' };
  for (let i = 0; i < name.length; i++) {
    const c = name.charCodeAt(i);
    if (c < 0x20 || c === 0x7f) return { ok: false, problem: `the entry name "${printable(name)}" holds a control character` };
  }
  const unified = name.replaceAll('\\', '/');
  if (unified.startsWith('/')) return { ok: false, problem: `"${name}" is an absolute path` };
  if (/^[a-z]:/i.test(unified)) return { ok: false, problem: `"${name}" starts with a drive letter` };
  const parts: string[] = [];
  for (const segment of unified.split('/')) {
    if (segment === '' || segment === '.') continue;
    if (segment === '..') return { ok: false, problem: `"${name}" climbs out of the archive (..)` };
    parts.push(segment);
  }
  if (parts.length === 0) return { ok: false, problem: `"${name}" names no file` };
  return { ok: true, path: parts.join('/') };
}

/**
 * The entry name as it may be shown and stored (a reject's path in a job result, the rejects file): each control
 * character written as \xNN. The raw name of a refused entry can hold a NUL, which PostgreSQL text and jsonb
 * cannot store: kept raw, it failed the whole upload's job instead of refusing that one entry.
 */
export function printableEntryName(name: string): string {
  return printable(name);
}

function printable(name: string): string {
  let out = '';
  for (const ch of name) {
    const c = ch.charCodeAt(0);
    out += c < 0x20 || c === 0x7f ? `\\x${c.toString(16).padStart(2, '0')}` : ch;
  }
  return out;
}
