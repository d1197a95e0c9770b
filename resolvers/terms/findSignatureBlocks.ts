/**
 * Signature blocks: the entity line above "By:" is the party ("QORV ROBOTICS, INC." / "By: ____" /
 * "Name: Jane Doe" / "Title: CEO"); a label line above it ("LICENSOR:") gives its role; the signer's
 * name and title are not parties. "For and on behalf of X" lines name a party too.
 */
import { locateNameAt } from './locateName.ts';
import type { LocatedName } from './locateName.ts';

export interface SignatureEntity {
  located: LocatedName;
  /** "LICENSOR:" above the entity line, without the colon. */
  label?: string;
  /** Signers' names and titles: seen, and not parties. */
  notParties: string[];
  /** A descriptive line under the entity line ("a Delaware corporation"). */
  description?: string;
}

interface Line {
  start: number;
  end: number;
  text: string;
}

/** Lines to look above "By:" for the entity (blank and signature-rule lines are skipped). */
const LOOK_UP = 6;
const MAX_ENTITY_LINE = 160;

function splitLines(text: string): Line[] {
  const lines: Line[] = [];
  let start = 0;
  for (let i = 0; i <= text.length; i++) {
    if (i === text.length || text[i] === '\n') {
      lines.push({ start, end: i, text: text.slice(start, i) });
      start = i + 1;
    }
  }
  return lines;
}

/** "By:", "BY :", "By: ______" — the anchor of a signature block. */
function labelValue(line: string, labels: readonly string[]): string | null {
  const t = line.trim();
  const lower = t.toLowerCase();
  for (const label of labels) {
    if (!lower.startsWith(label)) continue;
    let j = label.length;
    while (t[j] === ' ') j++;
    if (t[j] !== ':') continue;
    return stripRule(t.slice(j + 1));
  }
  return null;
}

/** Removes signature rules and markers: "______", "/s/", "[signature]". */
function stripRule(s: string): string {
  return s.replaceAll('/s/', ' ').replace(/[_.\-–—]{2,}/gu, ' ').replace(/\[[^\]]{0,40}\]/gu, ' ').trim();
}

function isSkippable(line: string): boolean {
  const t = stripRule(line).toLowerCase();
  return t.length === 0 || t === 'signature' || t === '(signature)' || t.startsWith('signature:') || t.startsWith('date:') || t.startsWith('dated:');
}

const BEHALF = ['signed for and on behalf of', 'for and on behalf of', 'on behalf of', 'executed as a deed by', 'executed by', 'for '];
/** Lines that name the signing entity without a "By:" line (UK execution blocks). */
const ON_BEHALF_LINES = ['for and on behalf of ', 'signed for and on behalf of ', 'executed by ', 'executed as a deed by '];

function entityFrom(text: string, line: Line): SignatureEntity | null {
  if (line.end - line.start > MAX_ENTITY_LINE) return null;
  let from = line.start;
  while (from < line.end && (text[from] === ' ' || text[from] === '\t')) from++;
  let label: string | undefined;
  // "LICENSOR: QORV ROBOTICS, INC."
  const colon = text.indexOf(':', from);
  if (colon >= 0 && colon < line.end) {
    const before = text.slice(from, colon).trim();
    if (before.split(/\s+/u).length <= 3 && text.slice(colon + 1, line.end).trim().length > 0) {
      label = before;
      from = colon + 1;
    } else if (text.slice(colon + 1, line.end).trim().length === 0) {
      return null; // a label alone: no entity on this line
    }
  }
  const lower = text.slice(from, line.end).toLowerCase().trimStart();
  const lead = text.slice(from, line.end).length - lower.length;
  for (const b of BEHALF) {
    if (lower.startsWith(b)) {
      from += lead + b.length;
      break;
    }
  }
  const located = locateNameAt(text, from, line.end, true);
  if (located === null) return null;
  return label === undefined ? { located, notParties: [] } : { located, label, notParties: [] };
}

export function findSignatureBlocks(text: string): SignatureEntity[] {
  const lines = splitLines(text);
  const found: SignatureEntity[] = [];
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i] as Line;
    const by = labelValue(line.text, ['by']);
    if (by !== null) {
      const entity = entityAbove(text, lines, i);
      if (entity === null) continue;
      if (by.length > 0) entity.notParties.push(by);
      for (let k = i + 1; k < Math.min(lines.length, i + 5); k++) {
        const v = labelValue((lines[k] as Line).text, ['name', 'title', 'its', 'print name', 'printed name']);
        if (v !== null && v.length > 0) entity.notParties.push(v);
      }
      found.push(entity);
      continue;
    }
    const lower = line.text.trim().toLowerCase();
    if (ON_BEHALF_LINES.some((b) => lower.startsWith(b)) && line.end - line.start <= MAX_ENTITY_LINE) {
      const entity = entityFrom(text, line);
      if (entity !== null) found.push(entity);
    }
  }
  return found;
}

function entityAbove(text: string, lines: Line[], byIndex: number): SignatureEntity | null {
  let description: string | undefined;
  for (let j = byIndex - 1; j >= 0 && j >= byIndex - LOOK_UP; j--) {
    const line = lines[j] as Line;
    if (isSkippable(line.text)) continue;
    // "QORV ROBOTICS, INC.," / "a Delaware corporation" / "By: ___": the descriptive line sits between.
    if (/^\s*(?:a|an)\s/u.test(line.text)) {
      description = line.text.trim();
      continue;
    }
    const entity = entityFrom(text, line);
    if (entity === null) return null;
    if (description !== undefined) entity.description = description;
    if (entity.label === undefined) {
      // A label on its own line above the entity: "LICENSOR:"
      for (let k = j - 1; k >= 0 && k >= j - 2; k--) {
        const t = (lines[k] as Line).text.trim();
        if (t.length === 0) continue;
        if (t.endsWith(':') && t.split(/\s+/u).length <= 3) entity.label = t.slice(0, -1).trim();
        break;
      }
    }
    return entity;
  }
  return null;
}
