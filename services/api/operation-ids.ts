/**
 * The operationId of every documented route, by method and path (OpenAPI path syntax): the method names a
 * generated client gets. Our own names, kept stable: a client written against one release keeps compiling
 * against the next, so rename one only with a note in docs/api.md. A route without an entry here fails
 * tests/services/api/operation-ids.test.ts.
 */
export const OPERATION_IDS: Readonly<Record<string, string>> = {
  'GET /healthz': 'checkHealth',
  'GET /v1/me': 'describeCallingKey',
  'GET /v1/keys': 'listKeys',
  'POST /v1/keys': 'createKey',
  'DELETE /v1/keys/{keyId}': 'revokeKey',
  'GET /v1/counterparties': 'searchCounterparties',
  'POST /v1/counterparties': 'createCounterparty',
  'GET /v1/counterparties/{id}': 'readCounterparty',
  'PATCH /v1/counterparties/{id}': 'changeCounterparty',
  'POST /v1/counterparties/merge': 'mergeCounterparties',
  'POST /v1/counterparties/{id}/split': 'splitCounterparty',
  'POST /v1/counterparties/{id}/relations': 'addRelation',
  'DELETE /v1/counterparties/{id}/relations/{relationId}': 'removeRelation',
  'GET /v1/counterparties/{id}/history': 'readCounterpartyHistory',
  'GET /v1/counterparties/{id}/mentions': 'listCounterpartyMentions',
  'GET /v1/counterparties/{id}/network': 'readCounterpartyNetwork',
  'POST /v1/counterparties/{id}/forget': 'forgetCounterparty',
  'GET /v1/counterparty-groups': 'listCounterpartyGroups',
  'GET /v1/history/{eventId}': 'readHistoryEvent',
  'POST /v1/history/{eventId}/undo': 'undoHistoryEvent',
  'GET /v1/changes': 'readChangeFeed',
  'POST /v1/mentions': 'resolveMention',
  'POST /v1/mentions/batch': 'resolveMentionBatch',
  'GET /v1/mentions/{id}': 'readMention',
  'POST /v1/mentions/{id}/unlink': 'unlinkMention',
  'POST /v1/mentions/{id}/set-aside': 'setMentionAside',
  'POST /v1/mentions/{id}/withdraw': 'withdrawMention',
  'GET /v1/own-entities': 'listOwnEntities',
  'POST /v1/own-entities': 'addOwnEntity',
  'DELETE /v1/own-entities/{id}': 'removeOwnEntity',
  'POST /v1/contracts': 'storeContract',
  'GET /v1/contracts': 'findContracts',
  'GET /v1/contracts/{id}': 'readContract',
  'GET /v1/contracts/by-source': 'readContractBySource',
  'GET /v1/review-items': 'listReviewItems',
  'GET /v1/review-items/{id}': 'readReviewItem',
  'POST /v1/review-items/{id}/decision': 'decideReviewItem',
  'GET /v1/stats/scores': 'readScoreDistribution',
  'GET /v1/exports/{kind}': 'exportRecords',
  'POST /v1/jobs/ingest': 'submitIngestJob',
  'POST /v1/jobs/contracts': 'submitContractsImportJob',
  'POST /v1/jobs/sweep': 'submitSweepJob',
  'POST /v1/jobs/reresolve': 'submitReresolveJob',
  'GET /v1/jobs/{id}': 'readJob',
};

/** The entry for a fastify route: `:id` path parameters in OpenAPI's `{id}` form. */
export function operationIdOf(method: string, url: string): string | undefined {
  return OPERATION_IDS[`${method.toUpperCase()} ${url.replace(/:(\w+)/g, '{$1}')}`];
}
