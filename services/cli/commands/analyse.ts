/**
 * `cpreg analyse "<name>" [--country XX] [--json]`: what name analysis makes of one name string — core name,
 * legal form (ISO 20275 codes), qualifiers, aliases, related entities, and whether it names a party.
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
// The CLI accepts the same longest name as the register and the API.
import { MAX_NAME_LENGTH } from '../../../resolvers/vocabulary.ts';

export default function register(program: Command): void {
  program
    .command('analyse')
    .description('analyse one party name: core name, legal form, qualifiers, aliases and party status')
    .argument('<name>', `the name as written (at most ${MAX_NAME_LENGTH} characters)`)
    .option('--country <code>', 'ISO 3166-1 alpha-2 or ISO 3166-2 code that narrows the legal-form codes, e.g. FR or US-DE')
    .option('--json', 'print the analysis as JSON')
    .action(async (name: unknown, options: { country?: string; json?: boolean }) => {
      if (typeof name !== 'string') throw new CliError('<name>: expected one name as a string');
      const length = [...name].length;
      if (length > MAX_NAME_LENGTH) {
        throw new CliError(`<name>: ${length} characters is over the limit of ${MAX_NAME_LENGTH}; nothing was analysed`);
      }
      const { analyseName } = await import('../../../resolvers/analyse/index.ts');
      let analysis;
      try {
        analysis = analyseName(name, { country: options.country });
      } catch (error) {
        if (error instanceof RangeError) throw new CliError(`--country: ${error.message}`, 1, { cause: error });
        throw error;
      }
      if (options.json) {
        process.stdout.write(`${JSON.stringify(analysis, null, 2)}\n`);
        return;
      }
      const lf = analysis.legalForm;
      const lines = [
        `input:       ${analysis.input}`,
        `normalised:  ${analysis.normalised}`,
        `core:        ${analysis.core}`,
        `legal form:  ${lf ? `${lf.text} (family ${lf.family}; ELF ${summarise(lf.elfCodes)}; ${summarise(lf.jurisdictions)})` : '(none)'}`,
        `qualifiers:  ${analysis.qualifiers.length > 0 ? analysis.qualifiers.join(', ') : '(none)'}`,
        `aliases:     ${analysis.aliases.length > 0 ? analysis.aliases.map((a) => `${a.kind}: ${a.name}`).join('; ') : '(none)'}`,
        `related:     ${analysis.related.length > 0 ? analysis.related.map((r) => `${r.relation}: ${r.name}`).join('; ') : '(none)'}`,
        `party:       ${PARTY_WORDS[analysis.partyStatus]}${analysis.partyReason ? ` (${REASON_WORDS[analysis.partyReason] ?? analysis.partyReason})` : ''}; kind ${analysis.kind}`,
      ];
      process.stdout.write(`${lines.join('\n')}\n`);
    });
}

/** The party status in words (the JSON keeps the key: party, needs_binding, not_a_party). */
const PARTY_WORDS: Record<string, string> = {
  party: 'a party',
  needs_binding: "needs binding: a role, term or pronoun that names a party only through a contract's definitions",
  not_a_party: 'not a party',
};

/** Why a name is not a party by itself, in words (the JSON keeps partyReason). */
const REASON_WORDS: Record<string, string> = {
  empty: 'empty',
  numeric: 'only digits',
  too_short: 'one character',
  signature_label: 'a signature-block label',
  pronoun: 'a pronoun',
  role_word: 'a role or collective word',
  place: 'a place',
  document: 'the document or a part of it',
};

/** Long code lists ("Ltd" stands for 140 codes) are shortened on the terminal; --json has them all. */
function summarise(items: readonly string[]): string {
  const shown = items.slice(0, 8).join(', ');
  return items.length > 8 ? `${shown} … ${items.length} in all, see --json` : shown;
}
