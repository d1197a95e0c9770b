/**
 * The letter stream of a name for legal-form matching: folded letters and digits only, each unit knowing
 * where it came from in the original text and whether it starts a word.
 * Buffers are reused between calls (scans are consumed before the next one starts) to spare the allocator.
 */
import { foldChar, isMarkCode, isWordCode } from './fold-char.ts';

export interface NameScan {
  length: number;
  /** Folded letter/digit UTF-16 units. */
  units: Uint16Array;
  /** Original start offset of the character each unit came from. */
  from: Int32Array;
  /** Original end offset (exclusive) of that character. */
  to: Int32Array;
  /** 1 when the unit is the first of a word (the character before it in the original is not a letter or digit). */
  wordStart: Uint8Array;
}

let shared: NameScan = allocate(256);

function allocate(capacity: number): NameScan {
  return {
    length: 0,
    units: new Uint16Array(capacity),
    from: new Int32Array(capacity),
    to: new Int32Array(capacity),
    wordStart: new Uint8Array(capacity),
  };
}

/** Scans text[start, end). The result is valid until the next call. */
export function scanName(text: string, start = 0, end = text.length): NameScan {
  // A character folds to at most a few units (ß → ss, ﷺ → many); 4 per code unit plus slack covers NFKD growth,
  // and `push` grows the buffers if a rare character needs more.
  if (shared.units.length < (end - start) * 2 + 16) shared = allocate((end - start) * 2 + 16);
  const scan = shared;
  scan.length = 0;
  let inWord = false;
  for (let i = start; i < end;) {
    const code = text.charCodeAt(i);
    if (code < 0x80) {
      if ((code >= 0x61 && code <= 0x7a) || (code >= 0x30 && code <= 0x39)) {
        push(code, i, i + 1, !inWord);
        inWord = true;
      } else if (code >= 0x41 && code <= 0x5a) {
        push(code + 32, i, i + 1, !inWord);
        inWord = true;
      } else inWord = false;
      i++;
      continue;
    }
    const cp = text.codePointAt(i) ?? code;
    const width = cp > 0xffff ? 2 : 1;
    if (isWordCode(cp)) {
      const f = foldChar(width === 1 ? (text[i] as string) : text.slice(i, i + 2));
      let first = true;
      for (let k = 0; k < f.length; k++) {
        const unit = f.charCodeAt(k);
        if (!isWordCode(unit) && !(unit >= 0xd800 && unit <= 0xdfff)) continue;
        push(unit, i, i + width, first && !inWord);
        first = false;
      }
      inWord = true;
    } else if (!isMarkCode(cp)) {
      inWord = false;
    }
    i += width;
  }
  return shared;
}

function push(unit: number, from: number, to: number, wordStart: boolean): void {
  let scan = shared;
  if (scan.length === scan.units.length) {
    const bigger = allocate(scan.units.length * 2);
    bigger.units.set(scan.units);
    bigger.from.set(scan.from);
    bigger.to.set(scan.to);
    bigger.wordStart.set(scan.wordStart);
    bigger.length = scan.length;
    shared = scan = bigger;
  }
  const at = scan.length++;
  scan.units[at] = unit;
  scan.from[at] = from;
  scan.to[at] = to;
  scan.wordStart[at] = wordStart ? 1 : 0;
}
