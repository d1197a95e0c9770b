/**
 * A variant of a generated name: one or two corruptions of kinds drawn from the mix.
 */
import { weightedIndex, type Random } from '../../resolvers/prng.ts';
import { corrupt, VARIANT_KINDS, type VariantKind } from './corrupt.ts';
import { renderName, type NameParts } from './render-name.ts';
import { DEFAULT_MIX, type NameMix } from './name-mix.ts';

/** One variant: a kind drawn from the mix (redrawn when it does not apply), maybe a second on top. */
export function makeVariant(parts: NameParts, rnd: Random, mix: NameMix = DEFAULT_MIX): { name: string; kind: string } | null {
  const first = applySome(parts, rnd, mix, undefined);
  if (!first) return null;
  if (!rnd.chance(mix.secondCorruption)) return { name: renderName(first.parts), kind: first.kind };
  const second = applySome(first.parts, rnd, mix, first.kind);
  if (!second) return { name: renderName(first.parts), kind: first.kind };
  return { name: renderName(second.parts), kind: `${first.kind}+${second.kind}` };
}

function applySome(parts: NameParts, rnd: Random, mix: NameMix, not: VariantKind | undefined): { parts: NameParts; kind: VariantKind } | null {
  const weights = VARIANT_KINDS.map((k) => (k === not ? 0 : mix.kinds[k]));
  for (let tries = 0; tries < 6; tries++) {
    const kind = VARIANT_KINDS[weightedIndex(weights, rnd)]!;
    const out = corrupt(kind, parts, rnd);
    if (out) return { parts: out, kind };
  }
  return null;
}
