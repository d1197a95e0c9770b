/**
 * `cpreg contract parse <file.txt> [--json] [--mention "the Licensee"]`: what the defined-terms reader finds in one
 * contract (parties, roles, terms, collective terms, non-party terms) and, with --mention, how that mention resolves
 * inside this contract. Nothing is stored.
 */
import type { Command } from 'commander';
import type { InContractResolution as Resolution, NotPartyGroups, ParsedContract as Parsed } from '../../../resolvers/terms/index.ts';
import { MAX_NAME_LENGTH } from '../../../resolvers/vocabulary.ts';
import { CliError } from '../cli-error.ts';
import { outcomeWords } from '../outcome-words.ts';

/** Same limit as resolvers/terms (MAX_CONTRACT_BYTES); repeated here so the file is refused before it is read. */
const MAX_BYTES = 1024 * 1024;

interface ParseOptions {
  json?: boolean;
  mention?: string;
}

async function readContract(file: string): Promise<string> {
  const { stat, readFile } = await import('node:fs/promises');
  let info;
  try {
    info = await stat(file);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EACCES' ? 'permission denied' : String(code ?? error);
    throw new CliError(`<file>: cannot read "${file}": ${why}`, 1, { cause: error });
  }
  if (!info.isFile()) throw new CliError(`<file>: "${file}" is not a regular file`);
  if (info.size > MAX_BYTES) {
    throw new CliError(`<file>: "${file}" is ${info.size} bytes; the limit is 1 MB (${MAX_BYTES} bytes); nothing was parsed`);
  }
  const bytes = await readFile(file);
  if (bytes.includes(0)) throw new CliError(`<file>: "${file}" contains NUL bytes: it looks like binary data; give a plain-text contract`);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch (error) {
    throw new CliError(`<file>: "${file}" is not valid UTF-8 text: give a plain-text contract in UTF-8`, 1, { cause: error });
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim().length === 0) throw new CliError(`<file>: "${file}" is empty: there is no contract text to parse`);
  return text;
}

export default function register(program: Command): void {
  const contract = program.command('contract').description("work with one contract's parties and defined terms");
  contract
    .command('parse')
    .description('print the parties, roles and defined terms found in a plain-text contract (nothing is stored)')
    .argument('<file>', 'a UTF-8 plain-text contract, at most 1 MB')
    .option('--json', 'print the result as JSON')
    .option('--mention <text>', 'also resolve this mention inside the contract, e.g. "the Licensee"')
    .showHelpAfterError(true)
    .action(async (file: string, options: ParseOptions) => {
      if (options.mention !== undefined && [...options.mention].length > MAX_NAME_LENGTH) {
        throw new CliError(`--mention: over the limit of ${MAX_NAME_LENGTH} characters`);
      }
      const text = await readContract(file);
      const { classifyNotParties, parseParties, resolveInContract } = await import('../../../resolvers/terms/index.ts');
      const parsed = parseParties(text);
      const resolution = options.mention === undefined ? undefined : resolveInContract(parsed, options.mention);
      if (parsed.reason !== undefined && parsed.reason.code !== 'no_parties_found') throw new CliError(`<file>: ${parsed.reason.message}`);
      if (options.json) {
        const out = resolution === undefined ? parsed : { ...parsed, mention: resolution };
        process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
        return;
      }
      process.stdout.write(`${formatText(parsed, resolution, classifyNotParties(parsed.notParties))}\n`);
    });
}

function formatText(parsed: Parsed, resolution: Resolution | undefined, left: NotPartyGroups): string {
  const lines: string[] = [];
  if (parsed.parties.length === 0) lines.push(`No parties found: ${parsed.reason?.message ?? ''}`);
  else lines.push(`Parties (${parsed.parties.length}):`);
  parsed.parties.forEach((p, i) => {
    const facts = [
      `role ${p.role ?? '(none)'}`,
      `terms ${p.terms.length > 0 ? p.terms.map((t) => `"${t}"`).join(', ') : '(none)'}`,
      p.jurisdiction === undefined ? undefined : `jurisdiction ${p.jurisdiction}`,
      p.legalForm === undefined ? undefined : `legal form ${p.legalForm.text} (${p.legalForm.family})`,
      p.kind,
      p.ownEntity ? 'OWN ENTITY' : undefined,
    ].filter((f) => f !== undefined);
    // Names are verbatim (a wrapped name keeps its line break); the terminal shows them on one line.
    lines.push(`  ${i + 1}. ${oneLine(p.name)}`, `     ${facts.join('; ')}`);
    if (p.identifiers.length > 0) {
      lines.push(`     identifiers: ${p.identifiers.map((id) => `${id.scheme} ${id.value}${id.problem ? ` (${id.problem})` : ''}`).join('; ')}`);
    }
    if (p.aliases.length > 0) lines.push(`     aliases: ${p.aliases.map((a) => `${a.kind} ${a.name}`).join('; ')}`);
    if (p.related.length > 0) lines.push(`     related: ${p.related.map((r) => `${r.relation} ${r.name}`).join('; ')}`);
    if (p.address !== undefined) lines.push(`     address: ${p.address}`);
  });
  for (const c of parsed.collectiveTerms) {
    lines.push(`Collective term "${c.term}": ${c.parties.length > 0 ? c.parties.join(', ') : '(no named party)'}`);
  }
  // Each group says why its names were left out: a place, the document itself, a role no party holds.
  if (left.places.length > 0) lines.push(`Places (not parties): ${left.places.join('; ')}`);
  if (left.documents.length > 0) lines.push(`Document references (not parties): ${left.documents.join('; ')}`);
  if (left.roles.length > 0) lines.push(`Roles not bound to a party: ${left.roles.join('; ')}`);
  // People who sign, witness or notarise, with the capacity and the party they sign for: never parties (issue 16).
  const signers = parsed.signers ?? [];
  if (signers.length > 0) {
    const described = signers.map((s) =>
      [s.name, s.title, s.capacity === 'signatory' ? undefined : s.capacity, s.signsFor === undefined ? undefined : `for ${oneLine(s.signsFor)}`]
        .filter((f) => f !== undefined)
        .join(', '),
    );
    lines.push(`Signers (not parties): ${described.join('; ')}`);
  }
  const signerNames = new Set(signers.map((s) => s.name));
  const other = left.other.filter((n) => !signerNames.has(n));
  if (other.length > 0) lines.push(`Not parties: ${other.join('; ')}`);
  // "X, which is not a party hereto": named by the contract, stored with it as mentioned, never one of its parties.
  const mentioned = (parsed.mentioned ?? []).map((m) => (m.terms.length > 0 ? `${m.name} (${m.terms.map((t) => `"${t}"`).join(', ')})` : m.name));
  if (mentioned.length > 0) lines.push(`Mentioned, not parties to this contract: ${mentioned.join('; ')}`);
  // An amendment or side letter: the register binds the terms it does not define through this earlier agreement.
  for (const a of parsed.earlierAgreements ?? []) {
    const facts = [
      a.title,
      a.date === undefined ? undefined : `dated ${a.date}`,
      a.reference === undefined ? undefined : `reference ${a.reference}`,
      a.parties.length > 0 ? `between ${a.parties.join(' and ')}` : undefined,
    ];
    lines.push(`Uses the defined terms of an earlier agreement: ${facts.filter((f) => f !== undefined).join(', ')}`);
  }
  for (const w of parsed.warnings ?? []) lines.push(`Warning: ${w}`);
  if (resolution !== undefined) {
    const who = resolution.party === undefined ? '' : ` → ${resolution.party.name}${resolution.party.role ? ` (${resolution.party.role})` : ''}`;
    lines.push(`Mention "${resolution.mention}": ${outcomeWords(resolution.status)}${who}`, `  ${resolution.explanation}`);
  }
  return lines.join('\n');
}

function oneLine(s: string): string {
  return s.split(/\s+/u).join(' ');
}
