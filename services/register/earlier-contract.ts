/**
 * The earlier contract whose defined terms an amendment or side letter uses (issue 16 item 9): each statement the
 * parse found (resolvers/terms findEarlierAgreements) is looked up in the register (db/queries/contracts.ts
 * earlierContractCandidates) and judged by resolvers/terms matchEarlierAgreement; the first statement that exactly one
 * stored contract agrees with decides. Two or more agreeing contracts bind none: the terms stay unbound.
 */
import { matchEarlierAgreement, type ParsedContract } from '../../resolvers/terms/index.ts';
import { earlierContractCandidates } from '../../db/queries/contracts.ts';
import type { Queryable } from '../../db/queries/util.ts';

export interface EarlierContract {
  contractId: number;
  source: string;
  externalId: string;
  title: string | null;
  parsed: ParsedContract;
  /** How it was recognised: by its reference number, or by title with date or parties. */
  how: 'reference' | 'title_and_date' | 'title_and_parties';
  /** The amendment's statement, as written. */
  statement: string;
}

export async function earlierContractOf(db: Queryable, contractId: number, parsed: ParsedContract): Promise<EarlierContract | null> {
  for (const ref of parsed.earlierAgreements ?? []) {
    const rows = await earlierContractCandidates(db, { reference: ref.reference, title: ref.title, excludeId: contractId });
    const agreeing: EarlierContract[] = [];
    for (const row of rows) {
      const candidateParsed = row.parsed as ParsedContract;
      const verdict = matchEarlierAgreement(ref, parsed, { externalId: row.externalId, title: row.title, head: row.head, parsed: candidateParsed });
      if (verdict.agrees) {
        agreeing.push({
          contractId: row.id,
          source: row.source,
          externalId: row.externalId,
          title: row.title,
          parsed: candidateParsed,
          how: verdict.how,
          statement: ref.statement,
        });
      }
    }
    // A reference number outranks title matches: several contracts may share a title, a number names one.
    const byReference = agreeing.filter((a) => a.how === 'reference');
    const pick = byReference.length > 0 ? byReference : agreeing;
    if (pick.length === 1) return pick[0] as EarlierContract;
  }
  return null;
}
