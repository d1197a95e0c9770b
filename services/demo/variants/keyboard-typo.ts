/**
 * Keystroke errors of a typist on a QWERTY keyboard (Christen & Pudjijono 2009: keyboard errors).
 */
import type { Random } from '../../../resolvers/prng.ts';

/** QWERTY neighbours of each letter (same row and the rows above and below). */
const KEY_NEIGHBOURS: Readonly<Record<string, string>> = {
  q: 'wa',
  w: 'qeas',
  e: 'wrsd',
  r: 'etdf',
  t: 'ryfg',
  y: 'tugh',
  u: 'yihj',
  i: 'uojk',
  o: 'ipkl',
  p: 'ol',
  a: 'qwsz',
  s: 'awedxz',
  d: 'serfcx',
  f: 'drtgvc',
  g: 'ftyhbv',
  h: 'gyujnb',
  j: 'huikmn',
  k: 'jiolm',
  l: 'kop',
  z: 'asx',
  x: 'zsdc',
  c: 'xdfv',
  v: 'cfgb',
  b: 'vghn',
  n: 'bhjm',
  m: 'njk',
};

function matchCase(template: string, c: string): string {
  return template === template.toUpperCase() && template !== template.toLowerCase() ? c.toUpperCase() : c;
}

/** One keystroke error: an adjacent key instead of the right one, an extra adjacent key, a missed key or
 * two keys swapped. The first letter is left alone: typists rarely get it wrong (common practice). */
export function keyboardTypo(s: string, rnd: Random): string | null {
  const positions: number[] = [];
  for (let i = 1; i < s.length; i++) if (KEY_NEIGHBOURS[s[i]!.toLowerCase()]) positions.push(i);
  if (positions.length === 0) return null;
  const i = rnd.pick(positions);
  const ch = s[i]!;
  const near = KEY_NEIGHBOURS[ch.toLowerCase()]!;
  switch (rnd.int(4)) {
    case 0:
      return s.slice(0, i) + matchCase(ch, rnd.pick([...near])) + s.slice(i + 1);
    case 1:
      return s.slice(0, i + 1) + matchCase(ch, rnd.pick([...near])) + s.slice(i + 1);
    case 2:
      return s.slice(0, i) + s.slice(i + 1);
    default: {
      const j = i + 1 < s.length ? i + 1 : i - 1;
      if (j < 1 || s[j] === ' ' || s[j] === ch) return s.slice(0, i) + s.slice(i + 1);
      const [a, b] = j > i ? [i, j] : [j, i];
      return s.slice(0, a) + s[b] + s[a] + s.slice(b + 1);
    }
  }
}
