/**
 * A person sets (or clears) a counterparty's jurisdiction. One `jurisdiction_changed` event whose ops are the row
 * images of the change (like every upkeep event), so replay and undo need nothing special.
 *
 * Identifiers already held keep their normalised values: the jurisdiction only guides how identifiers added
 * later are read, and candidate scoring reads the current value on every resolution.
 */
import { parseJurisdiction } from '../../resolvers/compare/index.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, invalid } from './errors.ts';
import { commitWritten } from './history/commit.ts';
import { lockActive, survivorFor } from './lock-active.ts';
import { touchCounterparty } from './touch-counterparty.ts';
import { write } from './transaction.ts';

export interface JurisdictionInput {
  /** ISO 3166-1 alpha-2 ("GB") or ISO 3166-2 ("US-DE"), any letter case; null clears it. */
  jurisdiction: string | null;
  expectedVersion?: number;
}

export interface JurisdictionChangeResult {
  counterpartyId: number;
  /** null when the counterparty already had this jurisdiction (nothing written, no event). */
  eventId: number | null;
  version: number;
  jurisdiction: string | null;
}

/** The checked, upper-cased code, or null; an INVALID_INPUT naming the field otherwise. */
export function checkJurisdiction(field: string, value: unknown): string | null {
  if (value === null) return null;
  if (typeof value !== 'string') throw invalid(field, 'must be an ISO 3166-1 alpha-2 or ISO 3166-2 code (e.g. "GB", "US-DE"), or null to clear it');
  try {
    return parseJurisdiction(value).code;
  } catch (error) {
    throw invalid(field, error instanceof RangeError ? error.message : String(error));
  }
}

export async function setJurisdiction(
  ctx: RegisterContext,
  counterpartyId: number,
  input: JurisdictionInput,
  who: ActorInput,
): Promise<JurisdictionChangeResult> {
  const jurisdiction = checkJurisdiction('jurisdiction', input.jurisdiction);
  return write(ctx, async (cs) => {
    const at = ctx.now();
    await lockActive(cs, [counterpartyId]);
    const id = survivorFor(cs, counterpartyId);
    const cp = await cs.require('counterparty', id);
    if (input.expectedVersion !== undefined && cp.version !== input.expectedVersion) {
      throw new RegisterError('STALE_VERSION', `counterparty ${id} is at version ${String(cp.version)}, not ${input.expectedVersion}: read it again`, {
        counterpartyId: id,
        version: cp.version,
      });
    }
    const previous = cp.jurisdiction ?? null;
    if (previous === jurisdiction) return { counterpartyId: id, eventId: null, version: cp.version, jurisdiction };
    await cs.update('counterparty', id, { jurisdiction });
    const after = await touchCounterparty(cs, id, at);
    const eventId = await commitWritten(cs, {
      type: 'jurisdiction_changed',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { counterpartyId: id, from: previous, to: jurisdiction },
    });
    return { counterpartyId: id, eventId, version: after.version, jurisdiction };
  });
}
