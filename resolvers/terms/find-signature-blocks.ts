/**
 * Signature blocks: the entity line above "By:" (or above a conformed "/s/ Jane Doe" line) is the party ("QORV
 * ROBOTICS, INC." / "By: ____" / "Name: Jane Doe" / "Title: CEO"); a label line above it ("LICENSOR:") gives its
 * role; the signer is a person signing for it, and the title the capacity she signs in: neither is a party, and a
 * title is no name at all. "For and on behalf of X" lines name a party too; in "Signed for and on behalf of X by
 * Y, President" the entity ends before "by".
 */
import { asciiLower } from './ascii-lower.ts';
import { analyseCached } from './analyse-cached.ts';
import { jobTitleOf } from './is-job-title.ts';
import { locateNameAt } from './locate-name.ts';
import type { LocatedName } from './locate-name.ts';
import { readPersonName } from './read-person-name.ts';
import { signerAfter, titleAfter } from './signer-phrases.ts';
import type { ContractSigner } from './types.ts';

export interface SignatureEntity {
  located: LocatedName;
  /** "LICENSOR:" above the entity line, without the colon. */
  label?: string;
  /** The people who sign for it in this block, with their titles: seen, and not parties. */
  signers: ContractSigner[];
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
  return s
    .replaceAll('/s/', ' ')
    .replace(/[_.\-–—]{2,}/gu, ' ')
    .replace(/\[[^\]]{0,40}\]/gu, ' ')
    .trim();
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
  // "Executed as a deed by X acting by a director in the presence of:": the colon closes the line, no label.
  const colon = text.indexOf(':', from);
  const execution = ON_BEHALF_LINES.some((b) => asciiLower(text.slice(from, line.end)).startsWith(b));
  // "LICENSOR: QORV ROBOTICS, INC."
  if (colon >= 0 && colon < line.end && !execution) {
    const before = text.slice(from, colon).trim();
    if (before.split(/\s+/u).length <= 3 && text.slice(colon + 1, line.end).trim().length > 0) {
      // "By: Tessaly Holdings GmbH, its general partner": a company signing for the party above, never a party.
      if (before.toLowerCase() === 'by') return null;
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
  // "Signed for and on behalf of X by Y, President": the entity ends before "by", Y signs for it.
  let end = line.end;
  // "… X acting by a director in the presence of:" (UK deed, common practice): the entity ends before the phrase.
  const lowerRest = asciiLower(text.slice(from, line.end));
  for (const cut of [' acting by ', ' acting through ', ' in the presence of']) {
    const k = lowerRest.indexOf(cut);
    if (k > 0 && from + k < end) end = from + k;
  }
  let signer: ContractSigner | undefined;
  const lowerLine = asciiLower(text.slice(from, end));
  for (let at = lowerLine.indexOf(' by '); at >= 0; at = lowerLine.indexOf(' by ', at + 4)) {
    const s = signerAfter(text, from + at + 4, line.end);
    if (s === null) continue;
    end = from + at;
    signer = { name: s.name, capacity: 'signatory', ...(s.title === undefined ? {} : { title: s.title }) };
    break;
  }
  const located = locateNameAt(text, from, end, true);
  if (located === null) return null;
  if (signer !== undefined) signer.signsFor = text.slice(located.nameStart, located.nameEnd);
  const signers = signer === undefined ? [] : [signer];
  return label === undefined ? { located, signers } : { located, label, signers };
}

/** An electronic-signature stamp in the place of "By:" ("Electronically signed by:" over the signer's name). */
const E_SIGNED = ['electronically signed by', 'digitally signed by', 'signed electronically by', 'e-signed by'];

/** Labels under "By:" that give the signer's name, and those that give her title. */
const NAME_LABELS = ['name', 'print name', 'printed name', 'name of signatory'];
const TITLE_LABELS = ['title', 'its', 'position', 'capacity', 'function'];
/** A witness or notary part of the block starts: its "Name:" is no longer the signatory's (findSigners reads it). */
const OTHER_SIGNERS = /^\s*(?:signature of )?(?:witness|notary|name of witness|in the presence of)/iu;

export function findSignatureBlocks(text: string): SignatureEntity[] {
  const lines = splitLines(text);
  const found: SignatureEntity[] = [];
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i] as Line;
    const by = labelValue(line.text, ['by']) ?? labelValue(line.text, E_SIGNED);
    const conformed = by === null && line.text.trimStart().startsWith('/s/');
    if (by !== null || conformed) {
      const entity = entityAbove(text, lines, i);
      if (entity === null) continue;
      // Above a bare "/s/" line only a company signs: stacked conformed signatures of individuals (a board's
      // signature page) have the previous signer's name above, who is no party.
      if (conformed && !readsAsCompany(text.slice(entity.located.nameStart, entity.located.fullEnd))) continue;
      const signer = blockSigner(text, lines, i, by);
      if (signer !== null) entity.signers.push({ ...signer, signsFor: text.slice(entity.located.nameStart, entity.located.nameEnd) });
      found.push(entity);
      continue;
    }
    const lower = asciiLower(line.text.trim());
    if (ON_BEHALF_LINES.some((b) => lower.startsWith(b)) && line.end - line.start <= MAX_ENTITY_LINE) {
      const entity = entityFrom(text, line);
      if (entity !== null) found.push(entity);
      continue;
    }
    // "Signed by Philippa Strand, director, for and on behalf of HEXHAM LOOM LTD": the entity follows "on behalf of".
    const behalf = asciiLower(line.text).indexOf('for and on behalf of ');
    if (lower.startsWith('signed by ') && behalf > 0 && line.end - line.start <= MAX_ENTITY_LINE) {
      // "… in the presence of:" closes the line: the entity ends before it.
      const presence = asciiLower(line.text).indexOf(' in the presence', behalf);
      const end = presence > 0 ? presence : line.text.length;
      const entity = entityFrom(text, { start: line.start + behalf, end: line.start + end, text: line.text.slice(behalf, end) });
      if (entity !== null) found.push(entity);
    }
  }
  return found;
}

/** The signer of a "By:" (or "/s/") line: the name on it or on a "Name:" line below, the title on a "Title:" line. */
function blockSigner(text: string, lines: Line[], at: number, byValue: string | null): ContractSigner | null {
  const line = lines[at] as Line;
  let name: string | undefined;
  let title: string | undefined;
  // "By: Jane Doe" (rules and "/s/" already stripped) or a conformed "/s/ Jane Doe" line.
  const value = byValue ?? readPersonName(text, line.start + line.text.indexOf('/s/') + 3, line.end)?.name ?? '';
  const t = jobTitleOf(value);
  // "By: its President" gives a title; "By: Jane Doe, duly authorized officer" a name (and maybe a title).
  if (t !== null) title = t;
  else ({ name, title } = nameAndTitle(value));
  for (let k = at + 1; k < Math.min(lines.length, at + 5); k++) {
    const t = (lines[k] as Line).text;
    if (OTHER_SIGNERS.test(t) || labelValue(t, ['by']) !== null) break;
    const n = labelValue(t, NAME_LABELS);
    if (n !== null && n.length > 0) ({ name, title } = nameAndTitle(n, title));
    const v = labelValue(t, TITLE_LABELS);
    if (v !== null && v.length > 0) title = v;
    // A conformed signature repeats the name, then the bare title: "Quentin Aldous" / "Chief Executive Officer".
    if (byValue === null && n === null && v === null && title === undefined) title = jobTitleOf(t) ?? undefined;
    // "By: /s/ Desmond Larue" / "Desmond Larue, President": the name repeated with the title after a comma.
    const at = name === undefined ? -1 : t.indexOf(name);
    if (n === null && v === null && title === undefined && at >= 0 && t.slice(0, at).trim() === '')
      title = titleAfter(t, at + (name as string).length, t.length);
  }
  if (name === undefined) return null;
  return title === undefined ? { name, capacity: 'signatory' } : { name, title, capacity: 'signatory' };
}

/** A legal form or an organisation word: the analysis says a company, not a person. */
function readsAsCompany(name: string): boolean {
  const a = analyseCached(name);
  return a.legalForm !== null || a.kind === 'organisation';
}

/** "Dr. Ysolde Farrin" → "Ysolde Farrin"; "Corbin Yates, duly authorized officer" → the name, and a title if it says one. */
function nameAndTitle(value: string, title?: string): { name?: string; title?: string } {
  if (value.length === 0) return title === undefined ? {} : { title };
  const read = readPersonName(value, 0, value.length);
  // A company that signs for the party (its general partner, its manager) is no person signing.
  const comma = value.indexOf(',');
  if (read === null && readsAsCompany(comma > 0 ? value.slice(0, comma) : value)) return title === undefined ? {} : { title };
  if (read === null) return title === undefined ? { name: value } : { name: value, title };
  const after = titleAfter(value, read.end, value.length) ?? title;
  return after === undefined ? { name: read.name } : { name: read.name, title: after };
}

function entityAbove(text: string, lines: Line[], byIndex: number): SignatureEntity | null {
  let description: string | undefined;
  for (let j = byIndex - 1; j >= 0 && j >= byIndex - LOOK_UP; j--) {
    const line = lines[j] as Line;
    if (isSkippable(line.text)) continue;
    // A job title belongs to the block above ("Title: CEO" / "Chief Executive Officer"): no entity for this one.
    if (jobTitleOf(stripRule(line.text).replace(/^title\s*:/iu, '')) !== null) return null;
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
