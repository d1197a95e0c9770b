/**
 * Checking and analysing a mention before any database work: field checks with the field named, identifiers
 * normalised (resolvers/identifiers), the name analysed (resolvers/analyse), and the content hash that makes a
 * repeated (source, externalId) with the same content a no-op.
 */
import { createHash } from 'node:crypto';
import type { NameAnalysis } from '../../../resolvers/analyse/index.ts';
import type { Identifier, MentionInput } from '../../../resolvers/vocabulary.ts';
import { invalid } from '../errors.ts';
import { analyse } from '../matching/analysis.ts';
import { checkName } from '../check-name.ts';
import { normaliseIdentifierOrThrow } from '../normalise-identifier-or-throw.ts';

import { MAX_ID_LENGTH } from '../../../resolvers/vocabulary.ts';
export const MAX_ADDRESS_LENGTH = 2000;
const COUNTRY = /^[A-Z]{2}(?:-[A-Z0-9]{1,3})?$/;

export interface PreparedMention {
  input: MentionInput;
  text: string;
  contentHash: string;
  analysis: NameAnalysis;
  identifiers: Identifier[];
  /** Identifiers left out because they did not validate (kept in the evidence, never dropped silently). */
  ignoredIdentifiers: { scheme: string; value: string; reason: string }[];
}

function checkId(field: string, value: unknown): string {
  if (typeof value !== 'string' || value.trim().length === 0) throw invalid(field, 'must be a non-empty string');
  if (value.length > MAX_ID_LENGTH) throw invalid(field, `is longer than ${MAX_ID_LENGTH} characters`);
  return value;
}

export function contentHash(input: MentionInput): string {
  const canonical = JSON.stringify([
    input.text,
    input.contract ? [input.contract.source, input.contract.externalId] : null,
    input.role ?? null,
    input.country ?? null,
    input.address ?? null,
    (input.identifiers ?? []).map((i) => [i.scheme, i.value, i.label ?? null]),
  ]);
  return createHash('sha256').update(canonical).digest('hex');
}

/**
 * `lenientIdentifiers`: keep going when an identifier does not validate (contract parties: the text is what it
 * is); otherwise a bad identifier is an error naming it.
 */
export function prepareMention(raw: MentionInput, options: { lenientIdentifiers?: boolean } = {}): PreparedMention {
  if (typeof raw !== 'object' || raw === null) throw invalid('mention', 'must be an object');
  const source = checkId('source', raw.source);
  const externalId = checkId('externalId', raw.externalId);
  const text = checkName('text', raw.text);
  let contract: MentionInput['contract'];
  if (raw.contract !== undefined && raw.contract !== null) {
    contract = { source: checkId('contract/source', raw.contract.source), externalId: checkId('contract/externalId', raw.contract.externalId) };
  }
  if (raw.country !== undefined && (typeof raw.country !== 'string' || !COUNTRY.test(raw.country))) {
    // The rule, not the value: a country column of a file can hold anything, personal data included (issue 17).
    throw invalid('country', 'must be ISO 3166-1 alpha-2 or ISO 3166-2 (e.g. DE, US-DE)');
  }
  if (raw.role !== undefined && (typeof raw.role !== 'string' || raw.role.length > MAX_ID_LENGTH)) {
    throw invalid('role', `must be a string of at most ${MAX_ID_LENGTH} characters`);
  }
  if (raw.address !== undefined && (typeof raw.address !== 'string' || raw.address.length > MAX_ADDRESS_LENGTH)) {
    throw invalid('address', `must be a string of at most ${MAX_ADDRESS_LENGTH} characters`);
  }
  if (raw.identifiers !== undefined && !Array.isArray(raw.identifiers)) throw invalid('identifiers', 'must be an array');
  const identifiers: Identifier[] = [];
  const ignoredIdentifiers: PreparedMention['ignoredIdentifiers'] = [];
  (raw.identifiers ?? []).forEach((identifier, i) => {
    try {
      const normalised = normaliseIdentifierOrThrow(`identifiers/${i}`, identifier, raw.country);
      if (!identifiers.some((x) => x.scheme === normalised.scheme && x.value === normalised.value)) identifiers.push(normalised);
    } catch (error) {
      if (!options.lenientIdentifiers) throw error;
      ignoredIdentifiers.push({ scheme: String(identifier?.scheme), value: String(identifier?.value), reason: (error as Error).message });
    }
  });
  const input: MentionInput = {
    source,
    externalId,
    text,
    ...(contract ? { contract } : {}),
    ...(raw.role !== undefined ? { role: raw.role } : {}),
    ...(raw.country !== undefined ? { country: raw.country } : {}),
    ...(raw.address !== undefined ? { address: raw.address } : {}),
    ...(raw.identifiers !== undefined ? { identifiers: raw.identifiers } : {}),
  };
  return {
    input,
    text,
    contentHash: contentHash(input),
    analysis: analyse(text, raw.country),
    identifiers,
    ignoredIdentifiers,
  };
}
