/**
 * Which mentions of a batch are stored already and with what content: resuming a run counts the unchanged ones as
 * already ingested with one query per batch.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { mentionsByRef } from '../../db/queries/mentions-by-ref.ts';
import { mentionKey, type MentionInput } from '../../resolvers/vocabulary.ts';

/** The content hash of each of these mentions already stored, by mentionKey(source, externalId). */
export async function storedHashes(db: Kysely<Database>, mentions: MentionInput[]): Promise<Map<string, string>> {
  const stored = await mentionsByRef(db, mentions);
  return new Map(stored.map((m) => [mentionKey(m.source, m.external_id), m.content_hash]));
}
