/**
 * The counterparty register: the public surface of services/register. Every function takes a RegisterContext
 * (createRegisterContext(db)) first; writes take an ActorInput ({ actor, reason?, requestId? }) last.
 * See docs/register.md for canonical-value rules, history and undo semantics and concurrency guarantees.
 */
export { createRegisterContext, type RegisterContext, type ActorInput } from './context.ts';
export { RegisterError, REGISTER_ERROR_CODES, type RegisterErrorCode } from './errors.ts';

// Resolution
export { resolveMention, type ResolveResult } from './resolve/resolve-mention.ts';
export { resolveBatch, type BatchItemResult } from './batch.ts';
export { reresolve, reresolveOne, type ReresolveSummary } from './reresolve.ts';
export { sweep, type SweepSummary } from './sweep.ts';

// Contracts and own entities
export { storeContract, PARTY_SOURCE_PREFIX, type ContractInput, type StoreContractResult } from './contracts.ts';
export { addOwnEntity, removeOwnEntity, ownEntities, type OwnEntityInput } from './own-entities.ts';

// Counterparties and upkeep
export {
  createCounterparty,
  renameCounterparty,
  addName,
  removeName,
  addIdentifier,
  removeIdentifier,
  getCounterparty,
  type CreateCounterpartyInput,
  type ChangeResult,
  type CounterpartyView,
} from './counterparties.ts';
export { chooseCanonicalName, type NameCandidate } from './canonical-name.ts';
export { setJurisdiction, checkJurisdiction, type JurisdictionInput, type JurisdictionChangeResult } from './jurisdiction.ts';
export { unlinkMention, setAsideMention, withdrawMention, withdrawMentionBySourceId, withdrawContract, type MentionChangeResult } from './upkeep.ts';
export { mergeCounterparties, type MergeInput, type MergeResult } from './merge-counterparties.ts';
export { splitCounterparty, type SplitInput, type SplitResult } from './split-counterparty.ts';
export { addRelation, removeRelation, type RelationInput } from './relations.ts';

// Review
export { decideReviewGroup, listRankedReviewItems, rankOpenReviewItems, type GroupDecisionResult, type RankedReviewItemDetail } from './review-queue.ts';
export { listReviewItems, decideReview, type ReviewDecisionInput, type ReviewDecisionResult, type ReviewItemDetail } from './review.ts';

// History
export { undoEvent, blockingEvents, type UndoResult, type BlockingEvent } from './history/undo.ts';
export { replayHistory, type ReplayOptions } from './history/replay.ts';
export { counterpartyHistory, changeFeed, historyEvent } from './history/read.ts';
export { stateSnapshot, type StateSnapshot } from './state/snapshot.ts';
export { STATE_TABLES, type StateTable } from './state/tables.ts';
export { reanalyseNames, REANALYSE_CHUNK, type ReanalyseResult } from './reanalyse-names.ts';
