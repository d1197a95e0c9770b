/**
 * The check stage of a batch: each input checked and analysed (resolve/prepare.ts); a bad one, or one whose
 * (source, externalId) the batch already holds, is rejected in place and the rest go on.
 */
import { mentionKey } from '../../resolvers/vocabulary.ts';
import { RegisterError } from './errors.ts';
import { prepareMention, type PreparedMention } from './resolve/prepare.ts';
import type { ResolveResult } from './resolve/result.ts';
import type { WalkInput } from './walk.ts';

export type BatchItemResult = ResolveResult | { status: 'rejected'; index: number; error: { code: string; message: string; field?: string } };

export function sortKey(p: PreparedMention): string {
  return mentionKey(p.input.source, p.input.externalId);
}

export type Checked = { index: number; prepared: PreparedMention; key: string };

/**
 * Stage 1, check: each input checked and analysed (one its caller prepared is taken as it is); a bad one or a
 * repeated (source, externalId) is rejected in place.
 */
export function checkInputs(inputs: readonly WalkInput[], results: BatchItemResult[]): Checked[] {
  const seen = new Map<string, number>();
  const checked: Checked[] = [];
  for (const [index, input] of inputs.entries()) {
    let prepared: PreparedMention;
    try {
      prepared = 'prepared' in input ? input.prepared : prepareMention(input);
    } catch (error) {
      if (!(error instanceof RegisterError)) throw error;
      const e = error;
      results[index] = {
        status: 'rejected',
        index,
        error: { code: e.code ?? 'INVALID_INPUT', message: e.message, ...(e.details?.field ? { field: String(e.details.field) } : {}) },
      };
      continue;
    }
    const key = sortKey(prepared);
    if (seen.has(key)) {
      results[index] = {
        status: 'rejected',
        index,
        error: {
          code: 'INVALID_INPUT',
          message: `the batch holds (source, externalId) ${prepared.input.source}/${prepared.input.externalId} twice (items ${seen.get(key)} and ${index})`,
        },
      };
      continue;
    }
    seen.set(key, index);
    checked.push({ index, prepared, key });
  }
  return checked;
}
