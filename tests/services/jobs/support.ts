/** Shared by the job suites: invented mentions with ground truth, NDJSON files, and a register's clustering. */
import { writeFileSync } from 'node:fs';
import type { Kysely } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { generateNames } from '../../../services/demo/generate-names.ts';
import type { MentionInput } from '../../../resolvers/vocabulary.ts';

export interface TruthMention extends MentionInput {
  entityId: string;
}

/** `count` invented organisation names (cpreg generate's generator) as mentions of one source. */
export function generatedMentions(count: number, seed: number, source = 'gen'): TruthMention[] {
  const out: TruthMention[] = [];
  let i = 0;
  for (const row of generateNames(count, seed))
    out.push({ source, externalId: `g${String(i++).padStart(7, '0')}`, text: row.name, country: row.country.slice(0, 2), entityId: row.entityId });
  return out;
}

export function writeNdjson(file: string, mentions: readonly MentionInput[]): void {
  writeFileSync(
    file,
    mentions.map(({ source, externalId, text, country }) => JSON.stringify({ source, externalId, text, ...(country ? { country } : {}) })).join('\n') + '\n',
  );
}

/**
 * The register's clustering of the given mentions: the counterparty each is linked to, or a label of its own
 * when it is not linked (review, not a party …), in the order given.
 */
export async function clusteringOf(db: Kysely<Database>, mentions: readonly MentionInput[]): Promise<string[]> {
  const rows = await db.selectFrom('mention').select(['source', 'external_id', 'counterparty_id']).execute();
  const byKey = new Map(rows.map((r) => [`${r.source}\u0000${r.external_id}`, r.counterparty_id === null ? null : Number(r.counterparty_id)]));
  return mentions.map((m) => {
    const key = `${m.source}\u0000${m.externalId}`;
    if (!byKey.has(key)) throw new Error(`mention ${m.source}/${m.externalId} is not in the register`);
    const cp = byKey.get(key);
    return cp === null || cp === undefined ? `alone:${key}` : `cp:${cp}`;
  });
}
