/**
 * Writing one mention's outcome inside a ChangeSet: a new counterparty with its names and identifiers, a link
 * (name sighting, identifiers the counterparty lacks), a review item, or just the mention's status.
 */
import { isStrongScheme, type NameKind } from '../../../resolvers/vocabulary.ts';
import type { HistoryEventType } from '../../../resolvers/vocabulary.ts';
import { addIdentifierRow } from '../add-identifier-row.ts';
import { addNameSighting } from '../add-name-sighting.ts';
import { createCounterpartyRow } from '../create-counterparty-row.ts';
import { lockActive, survivorFor } from '../lock-active.ts';
import { touchCounterparty } from '../touch-counterparty.ts';
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

/**
 * Writes one mention's outcome, step by step: the counterparty it names or creates, the mention row, what a link
 * adds to the counterparty (names, identifiers, a new version), and the review item a person answers.
 */
export async function applyOutcome(
  cs: ChangeSet,
  prepared: PreparedMention,
  outcome: Outcome,
  existing: StateRow<'mention'> | undefined,
  extra: { contractId: number | null; at: Date },
): Promise<Applied> {
  const { counterpartyId, created } = await counterpartyOf(cs, prepared, outcome, extra.at);
  const linking = (outcome.status === 'linked' || outcome.status === 'new') && counterpartyId !== null;
  const recorded = linking ? namesToRecord(prepared, outcome) : { recordedName: null, recordedAliases: [] };
  const values = await mentionValues(cs, prepared, outcome, counterpartyId, recorded, extra);
  const iso = extra.at.toISOString();
  const mention = existing ? await cs.update('mention', existing.id, values) : await cs.insert('mention', { ...values, created_at: iso });
  if (linking) await addToCounterparty(cs, counterpartyId, prepared, outcome, recorded, { mentionId: mention.id, ...extra });
  const reviewItemId = outcome.status === 'review' && counterpartyId !== null ? await openReviewItem(cs, mention, counterpartyId, outcome.score, iso) : null;
  return { mention: await cs.require('mention', mention.id), counterpartyId, reviewItemId, createdCounterparty: created };
}

/** The counterparty an outcome names (locked, followed to its survivor), or the one it creates. */
async function counterpartyOf(
  cs: ChangeSet,
  prepared: PreparedMention,
  outcome: Outcome,
  at: Date,
): Promise<{ counterpartyId: number | null; created: boolean }> {
  if (outcome.status === 'linked' || outcome.status === 'review') {
    const target = targetOf(outcome);
    await lockActive(cs, [target]);
    return { counterpartyId: survivorFor(cs, target), created: false };
  }
  if (outcome.status !== 'new') return { counterpartyId: null, created: false };
  const kind = prepared.analysis.kind === 'person' ? 'person' : prepared.analysis.kind === 'organisation' ? 'organisation' : 'unknown';
  const cp = await createCounterpartyRow(cs, { name: prepared.text, kind, jurisdiction: prepared.input.country ?? null, at });
  return { counterpartyId: cp.id, created: true };
}

/** The names a link records: the mention's own (when the outcome records it) and the other names it declares. */
interface Recorded {
  recordedName: RecordedName | null;
  recordedAliases: RecordedName[];
}

function namesToRecord(prepared: PreparedMention, outcome: Outcome): Recorded {
  const recordedName = outcome.recordName ? { name: prepared.text, kind: nameKindOf(prepared, outcome) } : null;
  return { recordedName, recordedAliases: declaredToRecord(outcome, recordedName, prepared) };
}

/** The mention's evidence: the names it recorded (so that moving it away takes exactly these sightings with it). */
function evidenceOf(recorded: Recorded, identifierConflicts: string[] = []): Record<string, unknown> {
  return {
    recordedName: recorded.recordedName,
    ...(recorded.recordedAliases.length > 0 ? { recordedAliases: recorded.recordedAliases } : {}),
    ...(identifierConflicts.length > 0 ? { identifierConflicts } : {}),
  };
}

/** The mention row as the outcome leaves it. */
async function mentionValues(
  cs: ChangeSet,
  prepared: PreparedMention,
  outcome: Outcome,
  counterpartyId: number | null,
  recorded: Recorded,
  extra: { contractId: number | null; at: Date },
): Promise<StateValues<'mention'>> {
  const input = prepared.input;
  return {
    source: input.source,
    external_id: input.externalId,
    text: prepared.text,
    content_hash: prepared.contentHash,
    contract_source: input.contract?.source ?? null,
    contract_external_id: input.contract?.externalId ?? null,
    contract_id: extra.contractId,
    role: input.role ?? null,
    country: input.country ?? null,
    address: input.address ?? null,
    identifiers: prepared.identifiers,
    status: outcome.status,
    counterparty_id: outcome.status === 'linked' || outcome.status === 'new' ? counterpartyId : null,
    own_entity_id: outcome.status === 'own_entity' ? (outcome.ownEntityId ?? null) : null,
    score: outcome.score,
    // The explanation is stored once (its own row, shared with the review item); the mention keeps its own keys.
    explanation_id: await cs.explain(outcome.evidence),
    evidence: evidenceOf(recorded),
    confirmed_by: null,
    updated_at: extra.at.toISOString(),
  };
}

/** What a link adds to its counterparty: the name sightings, the identifiers it lacks, a new version. */
async function addToCounterparty(
  cs: ChangeSet,
  counterpartyId: number,
  prepared: PreparedMention,
  outcome: Outcome,
  recorded: Recorded,
  where: { mentionId: number; contractId: number | null; at: Date },
): Promise<void> {
  const { mentionId, contractId, at } = where;
  const source = prepared.input.source;
  const confirmedBy = outcome.confirmedByIdentifier ? `identifier:${outcome.confirmedByIdentifier}` : null;
  if (recorded.recordedName) await addNameSighting(cs, counterpartyId, { ...recorded.recordedName, source, mentionId, contractId, confirmedBy }, at);
  for (const alias of recorded.recordedAliases) await addNameSighting(cs, counterpartyId, { ...alias, source, mentionId, contractId }, at);
  const notes = await addMentionIdentifiers(cs, counterpartyId, prepared, mentionId, confirmedBy, at);
  if (notes.length > 0) await cs.update('mention', mentionId, { evidence: evidenceOf(recorded, notes) });
  await touchCounterparty(cs, counterpartyId, at);
}

/** The review item that asks a person whether the mention is this counterparty (sharing the mention's explanation). */
async function openReviewItem(cs: ChangeSet, mention: StateRow<'mention'>, counterpartyId: number, score: Outcome['score'], iso: string): Promise<number> {
  const item = await cs.insert('review_item', {
    kind: 'mention_link',
    mention_id: mention.id,
    left_counterparty_id: null,
    right_counterparty_id: counterpartyId,
    score,
    explanation_id: mention.explanation_id,
    evidence: {},
    status: 'open',
    decision: null,
    decided_by: null,
    decided_at: null,
    reason: null,
    created_at: iso,
  });
  return item.id;
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
