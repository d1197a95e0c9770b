/**
 * People who sign, witness or notarise, in the shapes execution blocks take outside "By:/Name:/Title:" (which
 * findSignatureBlocks reads): "/s/ Quentin Aldous", "Signed for and on behalf of X by Y, President", "Signed by Y,
 * director", "Y, duly authorised", "acting through its director Y", "represented by Y", "Witness: Y",
 * "Name of witness: Y", "Notary Public: Y", "Y, Notary Public", "before me, Y, a notary", "personally appeared Y".
 * They are people acting for a party, never parties. Cue phrases are common practice in US, UK and translated
 * (French, German, Italian, Spanish) execution clauses.
 */
import { asciiLower } from './ascii-lower.ts';
import { analyseCached } from './analyse-cached.ts';
import { readPersonName } from './read-person-name.ts';
import { jobTitleOf } from './is-job-title.ts';
import { signerAfter, titleAfter } from './signer-phrases.ts';
import type { SignerAt } from './signer-phrases.ts';
import type { ContractSigner } from './types.ts';
import { afterRule, fromNameAndCapacity, fromNameCaptions, push, type Line } from './signer-lines.ts';

type Capacity = ContractSigner['capacity'];

/** Cues a signer's name follows, anywhere in a line. */
const AFTER_CUES: ReadonlyArray<readonly [string, Capacity]> = [
  ['signed by ', 'signatory'],
  ['acting by ', 'signatory'],
  ['acting through ', 'signatory'],
  ['represented by ', 'signatory'],
  ['represented herein by ', 'signatory'],
  ['duly represented by ', 'signatory'],
  ['représentée par ', 'signatory'],
  ['représenté par ', 'signatory'],
  ['representee par ', 'signatory'],
  ['vertreten durch ', 'signatory'],
  ['rappresentata da ', 'signatory'],
  ['rappresentato da ', 'signatory'],
  ['representada por ', 'signatory'],
  ['representado por ', 'signatory'],
  ['personally appeared ', 'signatory'],
  ['by its duly authorised officer ', 'signatory'],
  ['by its duly authorized officer ', 'signatory'],
  ['by its duly authorised signatory ', 'signatory'],
  ['by its duly authorized signatory ', 'signatory'],
  ['by its duly authorised representative ', 'signatory'],
  ['by its duly authorized representative ', 'signatory'],
  ['through its duly authorized representative ', 'signatory'],
  ['through its duly authorised representative ', 'signatory'],
  // An electronic signature stamp names the person who signed (common practice): no further check is needed.
  ['electronically signed by ', 'signatory'],
  ['digitally signed by ', 'signatory'],
  ['signed electronically by ', 'signatory'],
  ['in the presence of ', 'witness'],
  ['witnessed by ', 'witness'],
  ['before me, ', 'notary'],
  ['devant maître ', 'notary'],
];

const E_SIGNED_CUE = /^(?:electronically|digitally) signed by |^signed electronically by /u;

/** Labels whose value (same line, or the next "Name:" line) is a witness or notary. */
const LABELS: ReadonlyArray<readonly [string, Capacity]> = [
  ['witness', 'witness'],
  ['witness name', 'witness'],
  ['witness signature', 'witness'],
  ['signature of witness', 'witness'],
  ["witness's name", 'witness'],
  ['name of witness', 'witness'],
  ['print name of witness', 'witness'],
  ['witnessed by', 'witness'],
  ['in the presence of', 'witness'],
  ['témoin', 'witness'],
  ['zeuge', 'witness'],
  ['zeugin', 'witness'],
  ['testigo', 'witness'],
  ['testimone', 'witness'],
  ['notary public', 'notary'],
  ['notary', 'notary'],
  ['name of notary', 'notary'],
  ['notaire', 'notary'],
  ['notar', 'notary'],
  ['notarin', 'notary'],
  ['notario', 'notary'],
  ['notaio', 'notary'],
];

/** Words after "Y, " that make Y a notary or a signatory: "Y, Notary Public", "Y, duly authorised". */
const AFTER_NAME: ReadonlyArray<readonly [string, Capacity]> = [
  ['notary', 'notary'],
  ['a notary', 'notary'],
  ['notaire', 'notary'],
  ['notar', 'notary'],
  ['notario', 'notary'],
  ['notaio', 'notary'],
  ['duly authorised', 'signatory'],
  ['duly authorized', 'signatory'],
  ['authorised signatory', 'signatory'],
  ['authorized signatory', 'signatory'],
];

function linesOf(text: string): Line[] {
  const out: Line[] = [];
  let start = 0;
  for (let i = 0; i <= text.length; i++) {
    if (i === text.length || text[i] === '\n') {
      out.push({ start, end: i });
      start = i + 1;
    }
  }
  return out;
}

/**
 * "Witness:"-style label at the line start: its value's start, or -1. A job title as the label ("Director: Ingrid
 * Sallow", a UK deed's execution line, common practice) names a signatory signing in that capacity.
 */
function labelAt(text: string, line: Line): { value: number; capacity: Capacity; title?: string } | null {
  const raw = text.slice(line.start, line.end);
  const colon = raw.indexOf(':');
  if (colon <= 0 || colon > 30) return null;
  const label = raw.slice(0, colon).trim().toLowerCase().replace(/\s+/gu, ' ');
  const hit = LABELS.find(([l]) => l === label);
  if (hit !== undefined) return { value: line.start + colon + 1, capacity: hit[1] };
  const title = jobTitleOf(raw.slice(0, colon).trim());
  return title === null ? null : { value: line.start + colon + 1, capacity: 'signatory', title };
}

function fromLabels(text: string, lines: Line[], out: ContractSigner[]): void {
  for (let k = 0; k < lines.length; k++) {
    const line = lines[k] as Line;
    const label = labelAt(text, line);
    if (label === null) continue;
    const named = readPersonName(text, afterRule(text, label.value, line.end), line.end);
    if (named !== null) {
      push(out, { ...named, ...optionalTitle(titleAfter(text, named.end, line.end) ?? label.title) }, label.capacity);
      continue;
    }
    if (label.title !== undefined) continue;
    // "Witness: ________" then "Name: Theda Kornblum" on one of the next lines.
    for (let n = k + 1; n < Math.min(lines.length, k + 3); n++) {
      const next = lines[n] as Line;
      const m = /^\s*(?:print(?:ed)? )?name\s*:/iu.exec(text.slice(next.start, next.end));
      if (m === null) continue;
      const v = readPersonName(text, afterRule(text, next.start + m[0].length, next.end), next.end);
      if (v !== null) push(out, v, label.capacity);
      break;
    }
  }
}

function optionalTitle(title: string | undefined): { title?: string } {
  return title === undefined ? {} : { title };
}

function fromCues(text: string, lines: Line[], out: ContractSigner[]): void {
  for (const line of lines) {
    const lower = asciiLower(text.slice(line.start, line.end));
    for (const [cue, capacity] of AFTER_CUES) {
      let at = lower.indexOf(cue);
      while (at >= 0) {
        const s = signerAfter(text, line.start + at + cue.length, line.end);
        if (s !== null && (capacity !== 'signatory' || isSurelyPerson(s) || E_SIGNED_CUE.test(cue)))
          push(out, s, capacity === 'notary' && !/notar|notai/iu.test(lower) ? 'signatory' : capacity);
        at = lower.indexOf(cue, at + cue.length);
      }
    }
    fromOnBehalf(text, line, lower, out);
    fromNameThenWords(text, line, lower, out);
    fromForLine(text, line, lower.trimStart(), out);
  }
}

/**
 * "signed by" and "represented by" may introduce a company too ("represented by its general partner Fenwick GP"):
 * a signatory there needs a title beside the name, a form of address, or a name the analysis reads as a person's.
 */
function isSurelyPerson(s: SignerAt): boolean {
  return s.title !== undefined || s.addressed || analyseCached(s.name).kind === 'person';
}

/** "Signed for and on behalf of X by Y, President": Y signs for X. */
function fromOnBehalf(text: string, line: Line, lower: string, out: ContractSigner[]): void {
  const cue = lower.indexOf('on behalf of ');
  if (cue < 0) return;
  for (let at = lower.indexOf(' by ', cue); at >= 0; at = lower.indexOf(' by ', at + 4)) {
    const s = signerAfter(text, line.start + at + 4, line.end);
    if (s === null) continue;
    const entity = text.slice(line.start + cue + 'on behalf of '.length, line.start + at).trim();
    push(out, s, 'signatory', entity.length > 0 ? entity : undefined);
    return;
  }
}

/**
 * "For the Seller, Mr Baptiste Vautrin, Chairman" (French and Italian drafting in English, common practice): the
 * person after the comma signs when a form of address or a title says a person stands there.
 */
function fromForLine(text: string, line: Line, lower: string, out: ContractSigner[]): void {
  if (!lower.startsWith('for ')) return;
  const comma = lower.indexOf(', ');
  if (comma < 0 || comma > 60) return;
  const named = readPersonName(text, line.start + comma + 2, line.end);
  if (named === null) return;
  const title = titleAfter(text, named.end, line.end);
  if (named.addressed || title !== undefined) push(out, { ...named, ...optionalTitle(title) }, 'signatory');
}

/** "Anselm Voigt, duly authorised", "Hester Galloway, Notary Public": the name opens the line or follows a colon. */
function fromNameThenWords(text: string, line: Line, lower: string, out: ContractSigner[]): void {
  const starts = [line.start];
  const colon = lower.indexOf(':');
  if (colon > 0) starts.push(line.start + colon + 1);
  for (const from of starts) {
    const named = readPersonName(text, afterRule(text, from, line.end), line.end);
    if (named === null || text[named.end] !== ',') continue;
    const rest = lower.slice(named.end - line.start + 1).trimStart();
    const hit = AFTER_NAME.find(([w]) => rest.startsWith(w));
    if (hit === undefined) continue;
    push(out, { ...named, ...optionalTitle(titleAfter(text, named.end, line.end)) }, hit[1]);
    return;
  }
}

/** "/s/ Quentin Aldous" then, on the next lines, the name again and a bare title ("Chief Executive Officer"). */
function fromConformedSignatures(text: string, lines: Line[], out: ContractSigner[]): void {
  for (let k = 0; k < lines.length; k++) {
    const line = lines[k] as Line;
    const raw = text.slice(line.start, line.end);
    const at = raw.indexOf('/s/');
    if (at < 0 || raw.slice(0, at).trim().length > 0) continue;
    const named = readPersonName(text, line.start + at + 3, line.end);
    if (named === null) continue;
    let title = titleAfter(text, named.end, line.end);
    for (let n = k + 1; n < Math.min(lines.length, k + 3) && title === undefined; n++) {
      const next = text.slice((lines[n] as Line).start, (lines[n] as Line).end).trim();
      if (next === named.name || next.length === 0) continue;
      title = jobTitleOf(next.replace(/^title\s*:/iu, '')) ?? undefined;
      break;
    }
    push(out, { ...named, ...optionalTitle(title) }, 'signatory');
  }
}

/** Every signer, witness and notary the text names outside By:/Name:/Title: blocks, in text order of the scans. */
export function findSigners(text: string): ContractSigner[] {
  const lines = linesOf(text);
  const out: ContractSigner[] = [];
  fromConformedSignatures(text, lines, out);
  fromLabels(text, lines, out);
  fromCues(text, lines, out);
  fromNotaryLines(text, lines, out);
  fromNameAndCapacity(text, lines, out);
  fromNameCaptions(text, lines, out);
  return out;
}

/** A name alone on the line above a bare "Notary Public" line. */
function fromNotaryLines(text: string, lines: Line[], out: ContractSigner[]): void {
  for (let k = 1; k < lines.length; k++) {
    const t = text
      .slice((lines[k] as Line).start, (lines[k] as Line).end)
      .trim()
      .toLowerCase();
    // "Notary Public", and "Notary Public, State of Ohio" / "Notary Public in and for …" (US, common practice).
    const notary = /^notary public(?:,| in and for )/u.test(t);
    if (!notary && t !== 'notary public' && t !== 'notaire' && t !== 'notar' && t !== 'notario' && t !== 'notaio') continue;
    const above = lines[k - 1] as Line;
    const named = readPersonName(text, afterRule(text, above.start, above.end), above.end);
    if (named !== null && text.slice(named.end, above.end).trim().length === 0) push(out, named, 'notary');
  }
}
