/**
 * The scale generator: invented organisation names with known entity ids and realistic variants, streamed
 * so that a million names never sit in memory at once (only a shuffle window of a few thousand rows).
 * The mix of variants is documented in docs/generator.md; keep the two in step.
 */
import { seededRandom, weightedIndex, type Random } from '../../resolvers/prng.ts';
import { renderName } from './render-name.ts';
import { carriesMarker } from './hard-negatives.ts';
import type { GeneratedNameRow } from './generated-name-row.ts';
import { DEFAULT_MIX, type NameMix } from './name-mix.ts';
import { corePermutation } from './core-permutation.ts';
import { inventOrganisation, type InventedOrganisation } from './invent-organisation.ts';
import { imitation } from './imitation.ts';
import { makeVariant } from './make-variant.ts';

/** Above this, entity cores would repeat (see coreSpace); a clear limit beats silent duplicates. */
export const MAX_NAMES = 10_000_000;

/**
 * Yields `count` rows: originals and their variants, mixed by a shuffle window. Same seed, same rows.
 * Throws a RangeError naming the limit when count is out of range.
 */
export function* generateNames(count: number, seed: number, mix: NameMix = DEFAULT_MIX): Generator<GeneratedNameRow> {
  if (!Number.isInteger(count) || count < 0 || count > MAX_NAMES) {
    throw new RangeError(`names: expected a whole number from 0 to ${MAX_NAMES}, got ${count}`);
  }
  const rnd = seededRandom(seed);
  const cores = corePermutation(seed);
  // Entity cores are drawn in order 0, 1, 2 … and there are at most `count` entities: a core whose position
  // is `count` or more is never drawn, so an activity sibling can take it without repeating anyone's name.
  const drawn = (core: number): boolean => cores.indexOf(core) < count;
  const window: GeneratedNameRow[] = [];
  let emitted = 0;
  let entityIndex = 0;
  let coreIndex = 0;
  let previous: InventedOrganisation | undefined;
  while (emitted + window.length < count) {
    const sibling = previous ? imitation(previous, entityIndex, rnd, mix, drawn) : undefined;
    const org = sibling ?? inventOrganisation(cores.coreOf(coreIndex++), entityIndex, rnd);
    entityIndex++;
    previous = org;
    const rows = [originalRow(org), ...variantRows(org, rnd, mix)];
    for (const row of rows) {
      if (emitted + window.length >= count) break;
      window.push(row);
      if (window.length > mix.shuffleWindow) {
        yield takeRandom(window, rnd);
        emitted++;
      }
    }
  }
  while (window.length > 0) yield takeRandom(window, rnd);
}

function takeRandom<T>(items: T[], rnd: Random): T {
  const i = rnd.int(items.length);
  const item = items[i]!;
  items[i] = items[items.length - 1]!;
  items.pop();
  return item;
}

function originalRow(org: InventedOrganisation): GeneratedNameRow {
  const row: GeneratedNameRow = {
    entityId: org.entityId,
    name: renderName(org.parts),
    country: org.country,
    variantKind: 'original',
    siblingOf: org.siblingOf,
  };
  if (org.siblingKind) row.siblingKind = org.siblingKind;
  return row;
}

function variantRows(org: InventedOrganisation, rnd: Random, mix: NameMix): GeneratedNameRow[] {
  const n = weightedIndex(mix.variantsPerEntity, rnd);
  const rows: GeneratedNameRow[] = [];
  const seen = new Set<string>([renderName(org.parts)]);
  for (let v = 0; v < n; v++) {
    const variant = makeVariant(org.parts, rnd, mix);
    if (!variant || seen.has(variant.name)) continue;
    // A hard negative's variant that lost what sets it apart could be the imitated entity's name: not kept.
    if (org.marker !== undefined && !carriesMarker(variant.name, org.marker)) continue;
    seen.add(variant.name);
    rows.push({ entityId: org.entityId, name: variant.name, country: org.country, variantKind: variant.kind });
  }
  return rows;
}
