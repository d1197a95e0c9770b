/**
 * The personal values an erasure replaces and what replaces them (Secrets), and the one replacement applied to state
 * rows, history and stored answers alike, so that replaying the rewritten history gives the rewritten register.
 */

export type Secrets = Map<string, string>;

/**
 * Values shorter than this are not replaced anywhere (a three-character value would hit unrelated text, and
 * timestamps inside row images); the rule is the same for state rows and history, so replay stays exact.
 */
export const MIN_SECRET = 4;

/** A deep string replacement of every secret (longest first, so a full name goes before a part of it). */
export function replacer(secrets: Secrets): (value: unknown) => unknown {
  const ordered = [...secrets.entries()].filter(([from]) => from.length >= MIN_SECRET).sort((a, b) => b[0].length - a[0].length);
  const inString = (text: string): string => {
    let out = text;
    for (const [from, to] of ordered) if (out.includes(from)) out = out.split(from).join(to);
    return out;
  };
  const deep = (value: unknown): unknown => {
    if (typeof value === 'string') return inString(value);
    if (Array.isArray(value)) return value.map(deep);
    if (value && typeof value === 'object') {
      const out: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(value)) out[k] = deep(v);
      return out;
    }
    return value;
  };
  return deep;
}

/** The secrets as the searches look for them: long enough to replace, and written as JSON escapes them. */
export function needlesOf(secrets: Secrets): string[] {
  return [...secrets.keys()].filter((s) => s.length >= MIN_SECRET).map((s) => JSON.stringify(s).slice(1, -1));
}
