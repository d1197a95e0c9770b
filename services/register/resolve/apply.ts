/**
 * Writing one mention's outcome inside a ChangeSet: a new counterparty with its names and identifiers, a link
 * (name sighting, identifiers the counterparty lacks), a review item, or just the mention's status.
 */
import { isStrongScheme, type NameKind } from '../../../resolvers/vocabulary.ts';
import type { HistoryEventType } from '../../../resolvers/vocabulary.ts';
import { addIdentifierRow, addNameSighting, createCounterpartyRow, lockActive, survivorFor, touchCounterparty } from '../records.ts';
import { RegisterError } from '../errors.ts';
import type { ChangeSet } from '../state/change-set.ts';
import type { StateRow, StateValues } from '../state/tables.ts';
import type { RecordedName } from '../mention-names.ts';
import type { Outcome } from './decide.ts';
import type { PreparedMention } from './prepare.ts';

export interface Applied {
  mention: StateRow<'mention'>;
  counterpartyId: number | null;
  reviewItemId: number | null;
  createdCounterparty: boolean;
}

function nameKindOf(prepared: PreparedMention, outcome: Outcome): NameKind {
  if (outcome.nameKind) return outcome.nameKind;
  return prepared.analysis.legalForm ? 'legal' : 'observed';
}

/**
 * The other names to store beside the mention's own: those its contract declares for the party (outcome.declaredNames)
 * and, when the mention's own name is recorded, those its text introduces ("X f/k/a Y", "X d/b/a Y"); without the
 * recorded name itself and without repeats.
 */
function declaredToRecord(outcome: Outcome, recordedName: RecordedName | null, prepared: PreparedMention): RecordedName[] {
  const out: RecordedName[] = [];
  for (const d of [...(outcome.declaredNames ?? []), ...(recordedName ? prepared.analysis.aliases : [])]) {
    const same = (r: RecordedName) => r.name === d.name && r.kind === d.kind;
    if ((recordedName && same(recordedName)) || out.some(same)) continue;
    out.push({ name: d.name, kind: d.kind });
  }
  return out;
}

/** Identifiers of the mention that the counterparty does not hold yet; a strong one held elsewhere is noted. */
async function addMentionIdentifiers(
  cs: ChangeSet,
  counterpartyId: number,
  prepared: PreparedMention,
  mentionId: number,
  confirmedBy: string | null,
  at: Date,
): Promise<string[]> {
  const notes: string[] = [];
  for (const identifier of prepared.identifiers) {
    try {
      await addIdentifierRow(
        cs,
        counterpartyId,
        identifier,
        { source: prepared.input.source, mentionId, confirmedBy: isStrongScheme(identifier.scheme) ? confirmedBy : null },
        at,
      );
    } catch (error) {
      if (error instanceof RegisterError && error.code === 'IDENTIFIER_TAKEN') notes.push(error.message);
      else throw error;
    }
  }
  return notes;
}

/**
 * The counterparty a linked or review outcome names. A batch's clustered placeholder (batch-plan.ts clusteredWith)
 * gets its id before it is written, so one still without an id here is a bug, refused before it writes.
 */
export function targetOf(outcome: Outcome): number {
  if (outcome.counterpartyId === undefined) throw new Error(`a ${outcome.status} outcome without a counterpartyId`);
  return outcome.counterpartyId;
}

export async function applyOutcome(
  cs: ChangeSet,
  prepared: PreparedMention,
  outcome: Outcome,
  existing: StateRow<'mention'> | undefined,
  extra: { contractId: number | null; at: Date },
): Promise<Applied> {
  const at = extra.at;
  const iso = at.toISOString();
  let counterpartyId: number | null = null;
  let created = false;
  let recordedName: RecordedName | null = null;
  if (outcome.status === 'linked' || outcome.status === 'review') {
    const target = targetOf(outcome);
    await lockActive(cs, [target]);
    counterpartyId = survivorFor(cs, target);
  }
  if (outcome.status === 'new') {
    const kind = prepared.analysis.kind === 'person' ? 'person' : prepared.analysis.kind === 'organisation' ? 'organisation' : 'unknown';
    const cp = await createCounterpartyRow(cs, { name: prepared.text, kind, jurisdiction: prepared.input.country ?? null, at });
    counterpartyId = cp.id;
    created = true;
  }
  const values: StateValues<'mention'> = {
    source: prepared.input.source,
    external_id: prepared.input.externalId,
    text: prepared.text,
    content_hash: prepared.contentHash,
    contract_source: prepared.input.contract?.source ?? null,
    contract_external_id: prepared.input.contract?.externalId ?? null,
    contract_id: extra.contractId,
    role: prepared.input.role ?? null,
    country: prepared.input.country ?? null,
    address: prepared.input.address ?? null,
    identifiers: prepared.identifiers,
    status: outcome.status,
    counterparty_id: outcome.status === 'linked' || outcome.status === 'new' ? counterpartyId : null,
    own_entity_id: outcome.status === 'own_entity' ? (outcome.ownEntityId ?? null) : null,
    score: outcome.score,
    // The explanation is stored once (its own row, shared with the review item); the mention keeps its own keys.
    explanation_id: await cs.explain(outcome.evidence),
    evidence: { recordedName: null as RecordedName | null },
    confirmed_by: null,
    updated_at: iso,
  };
  const linking = (outcome.status === 'linked' || outcome.status === 'new') && counterpartyId !== null;
  if (linking && outcome.recordName) {
    recordedName = { name: prepared.text, kind: nameKindOf(prepared, outcome) };
    values.evidence = { recordedName };
  }
  // Kept in the evidence like recordedName, so that moving the mention away takes exactly these sightings with it.
  const recordedAliases = linking ? declaredToRecord(outcome, recordedName, prepared) : [];
  if (recordedAliases.length > 0) values.evidence = { ...values.evidence, recordedAliases };
  const mention = existing ? await cs.update('mention', existing.id, values) : await cs.insert('mention', { ...values, created_at: iso });
  const mentionId = mention.id;
  let reviewItemId: number | null = null;
  if (linking && counterpartyId !== null) {
    const confirmedBy = outcome.confirmedByIdentifier ? `identifier:${outcome.confirmedByIdentifier}` : null;
    if (recordedName) {
      await addNameSighting(cs, counterpartyId, { ...recordedName, source: prepared.input.source, mentionId, contractId: extra.contractId, confirmedBy }, at);
    }
    for (const alias of recordedAliases) {
      await addNameSighting(cs, counterpartyId, { ...alias, source: prepared.input.source, mentionId, contractId: extra.contractId }, at);
    }
    const notes = await addMentionIdentifiers(cs, counterpartyId, prepared, mentionId, confirmedBy, at);
    if (notes.length > 0) {
      await cs.update('mention', mentionId, {
        evidence: { recordedName, ...(recordedAliases.length > 0 ? { recordedAliases } : {}), identifierConflicts: notes },
      });
    }
    await touchCounterparty(cs, counterpartyId, at);
  }
  if (outcome.status === 'review' && counterpartyId !== null) {
    const item = await cs.insert('review_item', {
      kind: 'mention_link',
      mention_id: mentionId,
      left_counterparty_id: null,
      right_counterparty_id: counterpartyId,
      score: outcome.score,
      explanation_id: mention.explanation_id,
      evidence: {},
      status: 'open',
      decision: null,
      decided_by: null,
      decided_at: null,
      reason: null,
      created_at: iso,
    });
    reviewItemId = item.id;
  }
  return { mention: await cs.require('mention', mentionId), counterpartyId, reviewItemId, createdCounterparty: created };
}

export function canonicalNameIn(cs: ChangeSet, counterpartyId: number | null): string | undefined {
  return counterpartyId === null ? undefined : cs.cached('counterparty', counterpartyId)?.canonical_name;
}

/** The history event type for a mention's outcome (see docs/register.md, "Events of resolution"). */
export function eventTypeFor(previous: StateRow<'mention'> | undefined, applied: Applied, textChanged: boolean): HistoryEventType {
  if (textChanged) return 'mention_changed';
  if (applied.createdCounterparty) return 'created';
  const before = previous?.counterparty_id ?? null;
  const after = applied.mention.counterparty_id ?? null;
  if (after !== null && after !== before) return 'linked';
  if (before !== null && after === null) return 'unlinked';
  return previous ? 'mention_changed' : 'created';
}
