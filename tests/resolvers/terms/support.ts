/** Test input: up to 1 MB (the contract limit) of numbered repetitions, so no per-string shortcut can help. */
import { MAX_CONTRACT_BYTES } from '../../../resolvers/terms/index.ts';

export function grow(unit: (i: number) => string): string {
  const parts: string[] = [];
  let bytes = 0;
  for (let i = 0; ; i++) {
    const u = unit(i);
    if (bytes + u.length > MAX_CONTRACT_BYTES - 16) break;
    parts.push(u);
    bytes += u.length;
  }
  return parts.join('');
}
