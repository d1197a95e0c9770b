/**
 * Shared pieces of the signer scans, and the scans of signature blocks without a "By:" line: "Name:" over
 * "Position:", a printed name over its caption ("Name of director (print)").
 */
import { jobTitleOf } from './is-job-title.ts';
import { readPersonName } from './read-person-name.ts';
import type { SignerAt } from './signer-phrases.ts';
import type { ContractSigner } from './types.ts';

export interface Line {
  start: number;
  end: number;
}

export function push(out: ContractSigner[], s: SignerAt, capacity: ContractSigner['capacity'], signsFor?: string): void {
  const signer: ContractSigner = { name: s.name, capacity };
  if (s.title !== undefined) signer.title = s.title;
  if (signsFor !== undefined) signer.signsFor = signsFor;
  out.push(signer);
}

/** The value of a label with signature rules and "/s/" removed: where a name may start. */
export function afterRule(text: string, i: number, end: number): number {
  let j = i;
  for (;;) {
    while (j < end && (text[j] === ' ' || text[j] === '\t' || text[j] === '_' || text[j] === '.')) j++;
    if (text.startsWith('/s/', j)) j += 3;
    else return j;
  }
}

/** Labels of a signer's capacity under her "Name:" line. */
const CAPACITY_LABEL = /^\s*(?:title|position|capacity|function|its)\s*:(.*)$/iu;

/**
 * "Name: Leopold Aichinger" with "Position: Managing Director" on one of the next two lines, in a block with no
 * "By:" line ("For the Client:" / rule / Name / Position, common practice in translated contracts): a signatory.
 */
export function fromNameAndCapacity(text: string, lines: Line[], out: ContractSigner[]): void {
  for (let k = 0; k < lines.length; k++) {
    const line = lines[k] as Line;
    const m = /^\s*(?:print(?:ed)? )?name\s*:/iu.exec(text.slice(line.start, line.end));
    if (m === null) continue;
    const named = readPersonName(text, afterRule(text, line.start + m[0].length, line.end), line.end);
    if (named === null || text.slice(named.end, line.end).trim().length > 0) continue;
    for (let n = k + 1; n < Math.min(lines.length, k + 3); n++) {
      const cap = CAPACITY_LABEL.exec(text.slice((lines[n] as Line).start, (lines[n] as Line).end));
      if (cap === null) continue;
      const title = jobTitleOf((cap[1] as string).trim());
      if (title !== null) push(out, { ...named, title }, 'signatory');
      break;
    }
  }
}

/**
 * A caption under the printed name: "Hamish Dunleavy" / "Name of director (print)" (Australian and UK execution
 * blocks, common practice): the name above signs.
 */
const NAME_CAPTION = /^name of (?:director|secretary|company secretary|director\/company secretary|authori[sz]ed signatory|signatory)(?: \(print(?:ed)?\))?$/u;

export function fromNameCaptions(text: string, lines: Line[], out: ContractSigner[]): void {
  for (let k = 1; k < lines.length; k++) {
    const line = lines[k] as Line;
    if (!NAME_CAPTION.test(text.slice(line.start, line.end).trim().toLowerCase())) continue;
    const above = lines[k - 1] as Line;
    const named = readPersonName(text, afterRule(text, above.start, above.end), above.end);
    if (named !== null && text.slice(named.end, above.end).trim().length === 0) push(out, named, 'signatory');
  }
}
