/**
 * Blocking keys of a stored counterparty name (resolvers/block). Identifier keys are left out: identifiers have
 * their own indexed table, looked up directly.
 */
import { blockingKeys } from '../../../resolvers/block/index.ts';
import { analyse } from './analysis.ts';

export function nameBlockingKeys(name: { name: string }): string[] {
  return keysOfAnalysis(analyse(name.name));
}

export function keysOfAnalysis(analysis: ReturnType<typeof analyse>): string[] {
  return blockingKeys({ id: '', analysis }).filter((key) => !key.startsWith('i:') && !key.startsWith('w:'));
}
