/**
 * The letter stream of a name for legal-form matching: folded letters and digits only, each unit knowing
 * where it came from in the original text and whether it starts a word.
 */
import { foldChar, isMarkCode, isWordCode } from './foldChar.ts';

export interface NameScan {
  /** Folded letter/digit UTF-16 units. */
  units: number[];
  /** Original start offset of the character each unit came from. */
  from: number[];
  /** Original end offset (exclusive) of that character. */
  to: number[];
  /** 1 when the unit is the first of a word (the character before it in the original is not a letter or digit). */
  wordStart: number[];
}

export function scanName(text: string, start = 0, end = text.length): NameScan {
  const scan: NameScan = { units: [], from: [], to: [], wordStart: [] };
  let inWord = false;
  for (let i = start; i < end; ) {
    const code = text.codePointAt(i) ?? 0;
    const width = code > 0xffff ? 2 : 1;
    if (isWordCode(code)) {
      const folded = code < 0x80 ? (code >= 0x41 && code <= 0x5a ? code + 32 : code) : -1;
      if (folded >= 0) {
        push(scan, folded, i, i + 1, !inWord);
      } else {
        const f = foldChar(text.slice(i, i + width));
        let first = true;
        for (let k = 0; k < f.length; k++) {
          const unit = f.charCodeAt(k);
          if (!isWordCode(unit) && !(unit >= 0xd800 && unit <= 0xdfff)) continue;
          push(scan, unit, i, i + width, first && !inWord);
          first = false;
        }
      }
      inWord = true;
    } else if (!isMarkCode(code)) {
      inWord = false;
    }
    i += width;
  }
  return scan;
}

function push(scan: NameScan, unit: number, from: number, to: number, wordStart: boolean): void {
  scan.units.push(unit);
  scan.from.push(from);
  scan.to.push(to);
  scan.wordStart.push(wordStart ? 1 : 0);
}
