/**
 * A person's decision is never reset without a person. When a mention a person confirmed (linked by a review
 * decision, made new by "different", a rename…) comes back with another text, the new text is not resolved on its
 * own authority: it goes to the review queue as a new question about the counterparty the person chose, and the
 * explanation names the earlier decision. (A person's "not a party" has no counterparty to ask about: the new text
 * is resolved afresh, and its history event records the earlier status.)
 */
import type { StateRow } from '../state/tables.ts';
import type { Outcome } from './decide.ts';

export interface EarlierDecision {
  counterpartyId: number;
  confirmedBy: string;
  text: string;
  status: string;
}

/** The decision to keep asking about, read from the stored mention before it is detached; null when none. */
export function earlierDecisionOf(previous: StateRow<'mention'> | undefined, textChanged: boolean): EarlierDecision | null {
  if (!previous || !textChanged || !previous.confirmed_by || previous.counterparty_id === null || previous.counterparty_id === undefined) return null;
  return {
    counterpartyId: Number(previous.counterparty_id),
    confirmedBy: String(previous.confirmed_by),
    text: String(previous.text),
    status: String(previous.status),
  };
}

/** The outcome turned into a question for a person about the counterparty the earlier decision chose. */
export function askAgain(outcome: Outcome, earlier: EarlierDecision): Outcome {
  const candidates = Array.isArray(outcome.evidence.candidates) ? (outcome.evidence.candidates as { counterpartyId?: number; score?: number }[]) : [];
  const scored = candidates.find((c) => c.counterpartyId === earlier.counterpartyId)?.score;
  return {
    status: 'review',
    counterpartyId: earlier.counterpartyId,
    score: typeof scored === 'number' ? scored : null,
    recordName: true,
    evidence: {
      ...outcome.evidence,
      summary: `the text changed from "${earlier.text}" after ${earlier.confirmedBy} confirmed it as counterparty ${earlier.counterpartyId}: a person decides again`,
      heldBackBy: 'earlier_decision',
      earlierDecision: { ...earlier },
      automaticOutcome: { status: outcome.status, counterpartyId: outcome.counterpartyId ?? null },
    },
  };
}
