/**
 * The register's invariants as SQL checks, each returning its violations with the ids involved.
 * Read-only: these run inside one REPEATABLE READ transaction on PostgreSQL (see verify.ts), so that a
 * running service does not make a consistent register look broken halfway through the checks.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import {
  canonicalNameCandidates,
  counterpartyRedirects,
  decidedReviewFacts,
  finishedIngestRunCounts,
  mentionsOffActiveCounterparty,
  rowsOwnedByMerged,
  sharedStrongIdentifiers,
} from '../../db/queries/invariant-reads.ts';
import { STRONG_SCHEMES } from '../../resolvers/vocabulary.ts';
import { COUNT_KEYS } from '../ingest/ingest-counts.ts';
import { chooseCanonicalName, type NameCandidate } from '../register/canonical-name.ts';

export interface Violation {
  /** The check that failed (stable, snake_case). */
  check: string;
  /** What is wrong, in words that name the ids. */
  message: string;
  ids: Record<string, number | string | null>;
}

export type Check = (db: Kysely<Database>) => Promise<Violation[]>;

/** Every linked or new mention points to an existing, active counterparty. */
export const mentionsPointToActive: Check = async (db) => {
  const rows = await mentionsOffActiveCounterparty(db);
  return rows.map((r) => ({
    check: 'mention_not_on_active_counterparty',
    message:
      r.counterparty_id === null
        ? `mention ${r.id} is ${r.status} but has no counterparty`
        : `mention ${r.id} is ${r.status} on counterparty ${r.counterparty_id}, which is ${r.cp_status ?? 'missing'}`,
    ids: { mentionId: r.id, counterpartyId: r.counterparty_id },
  }));
};

/** A merged counterparty owns no names, identifiers or mentions. */
export const mergedOwnsNothing: Check = async (db) => {
  const rows = await rowsOwnedByMerged(db);
  return rows.map((r) => ({
    check: 'merged_counterparty_owns_rows',
    message: `merged counterparty ${r.counterparty_id} still owns ${r.what} ${r.id}`,
    ids: { counterpartyId: r.counterparty_id, [`${r.what}Id`]: r.id },
  }));
};

/** Every merged id's redirect chain ends in an active counterparty; an active one redirects nowhere. */
export const redirectChains: Check = async (db) => {
  const rows = await counterpartyRedirects(db);
  const byId = new Map(rows.map((r) => [r.id, { status: r.status, mergedInto: r.mergedInto }]));
  const out: Violation[] = [];
  for (const [id, row] of byId) {
    if (row.status === 'active') {
      if (row.mergedInto !== null)
        out.push({
          check: 'redirect_chain_broken',
          message: `active counterparty ${id} redirects to ${row.mergedInto}`,
          ids: { counterpartyId: id, mergedInto: row.mergedInto },
        });
      continue;
    }
    const seen = new Set<number>([id]);
    let at = row.mergedInto;
    let problem: string | null = null;
    for (;;) {
      if (at === null) {
        problem = `merged counterparty ${id} has no merged_into`;
        break;
      }
      if (seen.has(at)) {
        problem = `the redirect chain of ${id} loops at ${at}`;
        break;
      }
      seen.add(at);
      const next = byId.get(at);
      if (!next) {
        problem = `the redirect chain of ${id} reaches ${at}, which does not exist`;
        break;
      }
      if (next.status === 'active') break;
      at = next.mergedInto;
    }
    if (problem) out.push({ check: 'redirect_chain_broken', message: problem, ids: { counterpartyId: id, at } });
  }
  return out.sort((a, b) => Number(a.ids.counterpartyId) - Number(b.ids.counterpartyId));
};

/** A strong identifier (scheme + value) belongs to at most one active counterparty. */
export const strongIdentifiersUnique: Check = async (db) => {
  const rows = await sharedStrongIdentifiers(db, STRONG_SCHEMES);
  return rows.map((r) => {
    const ids = r.ids;
    return {
      check: 'strong_identifier_shared',
      message: `${r.scheme} identifier is held by ${ids.length} active counterparties: ${ids.join(', ')}`,
      // The value itself may be personal (a person's tax id): the ids are enough to find it.
      ids: { scheme: r.scheme, counterpartyIds: ids.join(',') },
    };
  });
};

/**
 * Every decided review item is reflected: decided_by and decided_at set, a labelled pair and a
 * review_decided event for it, a cannot-link for `different` on a pair, one survivor for `same` on a duplicate.
 */
export const reviewDecisionsReflected: Check = async (db) => {
  const items = await decidedReviewFacts(db);
  const survivors = await survivorMap(db);
  const out: Violation[] = [];
  const add = (id: number, message: string) =>
    out.push({ check: 'review_decision_not_reflected', message: `review item ${id}: ${message}`, ids: { reviewItemId: id } });
  for (const r of items) {
    const id = r.id;
    if (r.decision === null || r.decided_by === null || r.decided_at === null) add(id, 'decided without a decision, a decider or a time');
    // "not a party" is never a label (it says nothing about two names); every other decision is one.
    if (r.decision === 'not_a_party' && r.pairs > 0) add(id, 'decided "not a party" but kept as a labelled pair');
    if (r.decision !== 'not_a_party' && r.pairs < 1) add(id, 'no labelled pair records the decision');
    if (r.events < 1) add(id, 'no review_decided event in the history');
    if (r.left_counterparty_id === null) continue;
    const left = survivors(r.left_counterparty_id);
    const right = survivors(r.right_counterparty_id);
    if (r.decision === 'different' && r.cannot_links < 1) add(id, 'decided "different" but no cannot-link keeps the two apart');
    if (r.decision === 'different' && left === right) add(id, `decided "different" but both sides are now counterparty ${left}`);
    if (r.decision === 'same' && r.kind === 'duplicate' && left !== right) add(id, `decided "same" but the sides are still ${left} and ${right}`);
  }
  return out;
};

async function survivorMap(db: Kysely<Database>): Promise<(id: number) => number> {
  const rows = await counterpartyRedirects(db, { mergedOnly: true });
  const next = new Map(rows.map((r) => [r.id, r.mergedInto]));
  return (id) => {
    let at = id;
    for (let hops = 0; hops <= next.size; hops++) {
      const to = next.get(at);
      if (to === undefined || to === null) return at;
      at = to;
    }
    return at; // a loop: redirectChains reports it
  };
}

/** A finished ingest run's counts reconcile: read = the sum of the outcome counts. */
export const ingestCountsReconcile: Check = async (db) => {
  const runs = await finishedIngestRunCounts(db);
  const out: Violation[] = [];
  for (const run of runs) {
    const counts = run.counts;
    const read = Number(counts.read ?? 0);
    let sum = 0;
    for (const key of COUNT_KEYS) sum += Number(counts[key] ?? 0);
    if (sum !== read) {
      out.push({
        check: 'ingest_counts_do_not_reconcile',
        message: `ingest run ${run.id}: read ${read} but the outcomes add up to ${sum}`,
        ids: { ingestRunId: run.id },
      });
    }
  }
  return out;
};

/**
 * Every active counterparty whose name no person locked (and that no erasure pseudonymised) carries the canonical name the canonical-value rules
 * choose from its names (docs/register.md): a re-resolution or a merge that left another spelling, or a rule
 * changed without the stored names following, shows here.
 */
export const canonicalNamesFollowRules: Check = async (db) => {
  const rows = await canonicalNameCandidates(db);
  const byCounterparty = new Map<number, { canonical: string; names: NameCandidate[] }>();
  for (const r of rows) {
    const key = r.counterparty_id;
    const entry = byCounterparty.get(key) ?? { canonical: r.canonical_name, names: [] };
    entry.names.push({
      id: r.id,
      name: r.name,
      kind: r.kind,
      legal_form: r.legal_form,
      seen_count: r.seen_count,
      confirmed_by: r.confirmed_by,
    });
    byCounterparty.set(key, entry);
  }
  const out: Violation[] = [];
  for (const [id, entry] of byCounterparty) {
    const chosen = chooseCanonicalName(entry.names, entry.canonical);
    if (chosen && chosen.name !== entry.canonical) {
      out.push({
        check: 'canonical_name_rule',
        message: `counterparty ${id}: canonical name "${entry.canonical}" but the rules choose "${chosen.name}" (name ${chosen.id})`,
        ids: { counterpartyId: id },
      });
    }
  }
  return out;
};

export const INVARIANT_CHECKS: Record<string, Check> = {
  mention_not_on_active_counterparty: mentionsPointToActive,
  merged_counterparty_owns_rows: mergedOwnsNothing,
  redirect_chain_broken: redirectChains,
  strong_identifier_shared: strongIdentifiersUnique,
  review_decision_not_reflected: reviewDecisionsReflected,
  ingest_counts_do_not_reconcile: ingestCountsReconcile,
  canonical_name_rule: canonicalNamesFollowRules,
};
