/**
 * The matching key of a legal-form designator: its folded letters and digits only, so that
 * "S.A." ≡ "SA" ≡ "S. A.", "Pty. Ltd." ≡ "PTY LTD" and "S.à r.l." ≡ "SARL" share one key.
 * Token boundaries are checked on the name side (a designator must start a word), not in the key.
 */
import { foldChar, isMarkCode, isWordCode } from './fold-char.ts';

export function designatorKey(text: string): string {
  let key = '';
  for (const ch of text) {
    const code = ch.codePointAt(0) ?? 0;
    if (isMarkCode(code) || !isWordCode(code)) continue;
    for (const unit of foldChar(ch)) {
      if (isWordCode(unit.codePointAt(0) ?? 0)) key += unit;
    }
  }
  return key;
}

/** German umlauts are also written ae/oe/ue ("beschraenkter"); both spellings must reach the same form. */
export function umlautDigraphVariant(text: string): string | null {
  if (!/[äöü]/iu.test(text)) return null;
  return text.replace(/[äöü]/giu, (ch) => {
    const lower = ch.toLowerCase();
    return lower === 'ä' ? 'ae' : lower === 'ö' ? 'oe' : 'ue';
  });
}
