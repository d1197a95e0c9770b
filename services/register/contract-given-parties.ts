/**
 * A contract posted with the parties its contract system already knows: after the text is stored and its parties
 * read (storeContract), the given parties are reconciled with the parsed ones (resolvers/terms
 * reconcileGivenParties) and their disagreements reported; the identifiers given for a party the text names are
 * added to that party's mention, which is resolved again with them (a given identifier is evidence the text may
 * lack). A given party the text does not name is reported, never invented into the contract.
 */
import type { IdentifierScheme } from '../../resolvers/vocabulary.ts';
import { reconcileGivenParties, type PartyReconciliation } from '../../resolvers/terms/index.ts';
import { getMention } from '../../db/queries/mentions.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import type { StoreContractResult } from './contracts.ts';
import { analyse } from './matching/analysis.ts';
import { resolveMention, type ResolveResult } from './resolve/resolve-mention.ts';

export interface GivenParty {
  name: string;
  role?: string;
  definedTerm?: string;
  identifiers?: { scheme: string; value: string; label?: string }[];
}

export interface GivenPartiesResult {
  reconciliation: PartyReconciliation;
  /** The parties resolved again with the identifiers given for them. */
  identifiersAdded: (ResolveResult & { position: number })[];
}

const key = (i: { scheme: string; value: string }): string => `${i.scheme}\u0000${i.value}`;

export async function applyGivenParties(
  ctx: RegisterContext,
  stored: StoreContractResult,
  given: readonly GivenParty[],
  who: ActorInput,
): Promise<GivenPartiesResult> {
  const parties = stored.contract.parties;
  const reconciliation = reconcileGivenParties(
    given,
    parties.map((p) => ({ position: p.position, name: p.text, role: p.role, terms: p.terms })),
    (name) => analyse(name),
  );
  const identifiersAdded: GivenPartiesResult['identifiersAdded'] = [];
  for (const { given: gi, position } of reconciliation.matched) {
    const extra = given[gi]!.identifiers ?? [];
    const party = parties.find((p) => p.position === position)!;
    if (extra.length === 0 || party.ownEntityId !== null) continue;
    const mention = await getMention(ctx.db, party.mentionId);
    if (!mention) continue;
    const known = new Set(mention.identifiers.map(key));
    const fresh = extra.filter((i) => !known.has(key(i)));
    if (fresh.length === 0) continue;
    const result = await resolveMention(
      ctx,
      {
        source: mention.source,
        externalId: mention.externalId,
        text: mention.text,
        ...(mention.contract ? { contract: mention.contract } : {}),
        ...(mention.role ? { role: mention.role } : {}),
        ...(mention.country ? { country: mention.country } : {}),
        ...(mention.address ? { address: mention.address } : {}),
        identifiers: [...mention.identifiers, ...fresh].map((i) => ({
          scheme: i.scheme as IdentifierScheme,
          value: i.value,
          ...(i.label ? { label: i.label } : {}),
        })),
      },
      who,
    );
    identifiersAdded.push({ ...result, position });
  }
  return { reconciliation, identifiersAdded };
}
