/** A name as the register accepts it: a string, trimmed, not empty, at most MAX_NAME_LENGTH characters. */
import { MAX_NAME_LENGTH } from '../../resolvers/vocabulary.ts';
import { invalid } from './errors.ts';

export function checkName(field: string, name: unknown): string {
  if (typeof name !== 'string') throw invalid(field, 'must be a string');
  const trimmed = name.trim();
  if (trimmed.length === 0) throw invalid(field, 'must not be empty');
  if ([...trimmed].length > MAX_NAME_LENGTH) throw invalid(field, `is longer than ${MAX_NAME_LENGTH} characters`);
  return trimmed;
}
