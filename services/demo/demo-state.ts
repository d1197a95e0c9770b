/**
 * What an existing register is to the demo: empty, this scenario (built, or partly built), a demo of another
 * scenario, or a register that is not the demo at all. A user's own additions to a built demo (a contract posted
 * through the API, a review decided) leave it this scenario: they are counted, never taken for another scenario.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import {
  changesSince,
  contractTextsOfSource,
  firstFinishedIngest,
  mentionIdsOfSource,
  registerContents,
  type RegisterContents,
} from '../../db/queries/register-contents.ts';
import { countOf } from '../cli/count-words.ts';
import { CONTRACT_SOURCE, MENTION_SOURCE, type Scenario } from './scenario/index.ts';

export type DemoState =
  | { kind: 'empty' }
  | { kind: 'partial' | 'complete'; changedContracts: number }
  /** Most of the scenario's contract ids hold other texts: built from another seed. */
  | { kind: 'other' }
  /** Holds data and none of the scenario's contracts: someone's own register. */
  | { kind: 'not_demo'; contents: RegisterContents };

/** `builtSeed`: the seed the scenario files beside the database record, when they do. */
export async function demoState(db: Kysely<Database>, scenario: Scenario, builtSeed?: number): Promise<DemoState> {
  // Contracts come in as PDF, Word and text files: their stored text is the extracted one, whose line breaks differ.
  const words = (text: string | undefined): string => (text ?? '').split(/\s+/).filter(Boolean).join(' ');
  const texts = new Map(scenario.contracts.map((c) => [c.externalId, words(c.text)]));
  let same = 0;
  let changed = 0;
  for (const c of await contractTextsOfSource(db, CONTRACT_SOURCE)) {
    const expected = texts.get(c.external_id);
    if (expected === undefined) continue; // the user's own contract from the same source
    if (expected === words(c.text)) same++;
    else changed++;
  }
  if (same === 0) {
    // A different seed writes other texts under the same ids; one or two edited contracts do not make it another world.
    if (changed * 2 >= scenario.contracts.length) return { kind: 'other' };
    // Another seed may also date its contracts otherwise (other ids): a finished demo build still tells it.
    if (builtSeed !== undefined && builtSeed !== scenario.seed && (await firstFinishedIngest(db, MENTION_SOURCE))) return { kind: 'other' };
    const contents = await registerContents(db);
    const holdsAnything = contents.contracts + contents.mentions + contents.counterparties + contents.ownEntities > 0;
    return holdsAnything ? { kind: 'not_demo', contents } : { kind: 'empty' };
  }
  const mentionIds = new Set(scenario.mentions.map((m) => m.input.externalId));
  const storedMentions = (await mentionIdsOfSource(db, MENTION_SOURCE)).filter((id) => mentionIds.has(id)).length;
  const complete = same + changed === scenario.contracts.length && storedMentions === scenario.mentions.length;
  return { kind: complete ? 'complete' : 'partial', changedContracts: changed };
}

/** One line: what was added to the demo since its build finished (its mentions batch), or that nothing was. */
export async function additionsLine(db: Kysely<Database>, changedContracts: number): Promise<string> {
  const builtAt = await firstFinishedIngest(db, MENTION_SOURCE);
  if (!builtAt) return '';
  const since = await changesSince(db, builtAt);
  const mentions = Object.values(since.mentionsBySource).reduce((a, b) => a + b, 0);
  const sources = Object.keys(since.mentionsBySource).sort();
  const parts = [
    since.contracts > 0 ? countOf(since.contracts, 'contract') : '',
    mentions > 0 ? `${countOf(mentions, 'mention')} (${sources.length === 1 ? 'source' : 'sources'} ${sources.join(', ')})` : '',
    since.counterparties > 0 ? countOf(since.counterparties, 'counterparty', 'counterparties') : '',
    since.reviewDecisions > 0 ? countOf(since.reviewDecisions, 'review decision') : '',
    changedContracts > 0 ? `${countOf(changedContracts, 'scenario contract')} given another text` : '',
  ].filter(Boolean);
  const when = `${builtAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
  if (parts.length === 0 && since.historyEvents === 0) return `nothing added since it was built (${when})`;
  const history = since.historyEvents > 0 ? `; ${countOf(since.historyEvents, 'change')} in the history` : '';
  return `added since it was built (${when}): ${parts.length > 0 ? parts.join(', ') : 'no new records'}${history}`;
}
