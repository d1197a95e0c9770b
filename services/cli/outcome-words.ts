/**
 * What each outcome of a mention means, in words, for the summaries the command line prints (ingest, contracts
 * import, a job's result). The JSON keeps the keys; a person reads these.
 */
export const OUTCOME_WORDS: Record<string, string> = {
  linked: 'linked',
  review: 'in review',
  new: 'new counterparty',
  own_entity: 'own entity',
  not_a_party: 'not a party',
  unbound_term: 'unbound defined term',
  collective_term: 'collective term',
  already_ingested: 'already ingested',
  rejected: 'rejected',
};

/** An outcome key in words; a key with no words yet is shown with spaces, never with its underscores. */
export function outcomeWords(key: string): string {
  return OUTCOME_WORDS[key] ?? key.replace(/_/g, ' ');
}
