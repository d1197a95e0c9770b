/**
 * One found document into the register through the one contract path (services/register storeContract, what
 * POST /v1/contracts calls): parties, roles and defined terms parsed, each party resolved, history written. The
 * external id is the file's path inside the folder or archive, so the same file imported again is the same
 * contract: the same text answers `unchanged`; another text is a new version of that contract (the register
 * updates it and records the change in its history).
 */
import type { RejectReason } from '../../resolvers/files/index.ts';
import { checkContractText } from '../../resolvers/terms/index.ts';
import type { ActorInput, RegisterContext } from '../register/context.ts';
import { storeContract } from '../register/contracts.ts';
import { RegisterError } from '../register/errors.ts';

export interface StoredParty {
  name: string;
  role: string | null;
  status: string;
  counterpartyId: number | null;
  canonicalName: string | null;
  ownEntityId: number | null;
  reviewItemId: number | null;
}

export type DocumentOutcome =
  | { kind: 'imported'; change: 'new' | 'changed'; contractId: number; parties: StoredParty[] }
  | { kind: 'unchanged'; contractId: number; partyCount: number }
  | { kind: 'rejected'; reason: RejectReason; detail: string };

export interface DocumentInput {
  path: string;
  title: string;
  text: string;
  /** The contract's external id when it is not the path (the demo keeps its scenario's ids). Default: path. */
  externalId?: string;
}

export interface StoreDocumentOptions {
  /** Refuse a text in which the parser finds no party (`no_parties`). Default true. */
  requireParties?: boolean;
}

const TEXT_PROBLEMS: Record<string, RejectReason> = { too_large: 'text_too_large', empty_text: 'no_text', binary_data: 'unsupported_type' };

export async function storeDocument(
  ctx: RegisterContext,
  doc: DocumentInput,
  source: string,
  who: ActorInput,
  options: StoreDocumentOptions = {},
): Promise<DocumentOutcome> {
  const problem = checkContractText(doc.text);
  if (problem) return { kind: 'rejected', reason: TEXT_PROBLEMS[problem.code] ?? 'contract_refused', detail: problem.message };
  const externalId = doc.externalId ?? doc.path;
  let result;
  try {
    result = await storeContract(ctx, { source, externalId, title: doc.title, text: doc.text }, who, { requireParties: options.requireParties ?? true });
  } catch (error) {
    if (!(error instanceof RegisterError) || error.code !== 'INVALID_INPUT') throw error;
    if (error.details.reason === 'no_parties_found') return { kind: 'rejected', reason: 'no_parties', detail: error.message.replace(/^text: /, '') };
    return { kind: 'rejected', reason: 'contract_refused', detail: error.message };
  }
  if (result.alreadyStored) return { kind: 'unchanged', contractId: result.contractId, partyCount: result.contract.parties.length };
  return {
    kind: 'imported',
    change: result.previouslyStored ? 'changed' : 'new',
    contractId: result.contractId,
    parties: result.parties.map((p) => ({
      name: result.contract.parties.find((c) => c.position === p.position)?.text ?? '',
      role: p.role,
      status: p.status,
      counterpartyId: p.counterpartyId,
      canonicalName: p.canonicalName,
      ownEntityId: p.ownEntityId,
      reviewItemId: p.reviewItemId,
    })),
  };
}
