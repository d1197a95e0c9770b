/** An identifier as the register accepts it: normalised by its scheme's rules, or refused naming the field. */
import type { IdentifierScheme } from '../../resolvers/vocabulary.ts';
import { normaliseIdentifier } from '../../resolvers/identifiers/index.ts';
import { invalid } from './errors.ts';

export interface IdentifierInput {
  scheme: string;
  value: string;
  label?: string;
}

export interface NormalisedIdentifier {
  scheme: IdentifierScheme;
  value: string;
  label?: string;
}

export function normaliseIdentifierOrThrow(field: string, input: IdentifierInput, country?: string | null): NormalisedIdentifier {
  const result = normaliseIdentifier(input, country ? { defaultCountry: country } : {});
  if (!result.ok) throw invalid(field, result.reason);
  return result.identifier;
}
