/**
 * Canonical JSON of a parsed JSON value: JSON.stringify's text with every object's keys in code-unit order, so
 * that two bodies that differ only in key order are one request to the idempotency check (issue 17 item 15).
 * Iterative: a deeply nested value cannot overflow the stack (JSON.stringify recurses and threw a RangeError on
 * a 20,000-deep body, which answered 500). Values that are not JSON follow JSON.stringify's rules: an undefined
 * or function member is left out, undefined in an array is null, a non-finite number is null.
 */
type Step = { text: string } | { value: unknown };

function leaf(value: unknown): string | undefined {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'string':
    case 'boolean':
      return JSON.stringify(value);
    case 'number':
      return Number.isFinite(value) ? JSON.stringify(value) : 'null';
    case 'bigint':
      return value.toString();
    case 'object':
      return undefined;
    default:
      return 'null'; // undefined, function, symbol: only reachable inside an array (members are skipped)
  }
}

function isDropped(value: unknown): boolean {
  return value === undefined || typeof value === 'function' || typeof value === 'symbol';
}

export function canonicalJson(value: unknown): string {
  if (isDropped(value)) return 'null';
  const out: string[] = [];
  const steps: Step[] = [{ value }];
  while (steps.length > 0) {
    const step = steps.pop()!;
    if ('text' in step) {
      out.push(step.text);
      continue;
    }
    const text = leaf(step.value);
    if (text !== undefined) {
      out.push(text);
      continue;
    }
    const v = step.value as object;
    // Steps run last-in first-out: each container pushes its closing bracket first and its first member last.
    if (Array.isArray(v)) {
      steps.push({ text: ']' });
      for (let i = v.length - 1; i >= 0; i--) {
        steps.push({ value: v[i] });
        if (i > 0) steps.push({ text: ',' });
      }
      steps.push({ text: '[' });
    } else {
      const record = (typeof (v as { toJSON?: unknown }).toJSON === 'function' ? (v as { toJSON(): unknown }).toJSON() : v) as Record<string, unknown>;
      if (record === null || typeof record !== 'object') {
        steps.push({ value: record });
        continue;
      }
      const keys = Object.keys(record)
        .filter((key) => !isDropped(record[key]))
        .sort();
      steps.push({ text: '}' });
      for (let i = keys.length - 1; i >= 0; i--) {
        const key = keys[i]!;
        steps.push({ value: record[key] });
        steps.push({ text: `${i > 0 ? ',' : ''}${JSON.stringify(key)}:` });
      }
      steps.push({ text: '{' });
    }
  }
  return out.join('');
}
