/** Compares parseParties' result on one corpus case with its expectations; returns the differences. */
import { parseParties, resolveInContract, termKey } from '../../../../resolvers/terms/index.ts';
import type { ParsedContract } from '../../../../resolvers/terms/index.ts';
import type { CorpusCase } from './contracts.ts';
import { oneLine } from '../../../../resolvers/terms/parse-parties.ts';

const sameList = (a: string[], b: string[]): boolean => a.length === b.length && a.every((x, i) => x === b[i]);
const sameSet = (a: string[], b: string[]): boolean => a.length === b.length && a.every((x) => b.includes(x));

export function checkCase(
  c: CorpusCase,
  parsed: ParsedContract = parseParties(c.text, c.ownEntities === undefined ? {} : { ownEntities: c.ownEntities }),
): string[] {
  const diffs: string[] = [];
  const names = parsed.parties.map((p) => p.name);
  const want = c.parties.map((p) => p.name);
  if (!sameList(names, want)) diffs.push(`parties: got ${JSON.stringify(names)}, want ${JSON.stringify(want)}`);
  for (const e of c.parties) {
    const p = parsed.parties.find((x) => x.name === e.name);
    if (p === undefined) continue;
    // Verbatim, a line break inside a name read as one space (oneLine).
    if (!oneLine(c.text).includes(p.name)) diffs.push(`${e.name}: name not verbatim in the text`);
    if (!sameSet(p.terms, e.terms)) diffs.push(`${e.name}: terms ${JSON.stringify(p.terms)}, want ${JSON.stringify(e.terms)}`);
    if (e.ownEntity !== undefined && p.ownEntity !== e.ownEntity) diffs.push(`${e.name}: ownEntity ${p.ownEntity}, want ${e.ownEntity}`);
    if (e.role !== undefined && p.role !== e.role) diffs.push(`${e.name}: role ${JSON.stringify(p.role)}, want ${JSON.stringify(e.role)}`);
    if (e.jurisdiction !== undefined && p.jurisdiction !== e.jurisdiction) diffs.push(`${e.name}: jurisdiction ${p.jurisdiction}, want ${e.jurisdiction}`);
    if (e.kind !== undefined && p.kind !== e.kind) diffs.push(`${e.name}: kind ${p.kind}, want ${e.kind}`);
    if (e.address !== undefined && !(p.address ?? '').includes(e.address))
      diffs.push(`${e.name}: address ${JSON.stringify(p.address)}, want it to contain ${JSON.stringify(e.address)}`);
    for (const id of e.identifiers ?? []) {
      const got = p.identifiers.find((x) => x.scheme === id.scheme && x.value === id.value);
      if (got === undefined) diffs.push(`${e.name}: identifier ${id.scheme} ${id.value} missing (got ${JSON.stringify(p.identifiers)})`);
      else if ((got.problem !== undefined) !== (id.problem === true))
        diffs.push(`${e.name}: identifier ${id.scheme} ${id.value} problem ${JSON.stringify(got.problem)}`);
    }
    for (const a of e.aliases ?? []) {
      if (!p.aliases.some((x) => x.kind === a.kind && x.name === a.name))
        diffs.push(`${e.name}: alias ${a.kind} ${a.name} missing (got ${JSON.stringify(p.aliases)})`);
    }
    for (const r of e.related ?? []) {
      if (!p.related.some((x) => x.relation === r.relation && x.name === r.name))
        diffs.push(`${e.name}: related ${r.relation} ${r.name} missing (got ${JSON.stringify(p.related)})`);
    }
  }
  const wantCollective = c.collective ?? [];
  const gotCollective = parsed.collectiveTerms.map((k) => `${k.term}=${JSON.stringify(k.parties)}`);
  const wantC = wantCollective.map((k) => `${k.term}=${JSON.stringify(k.parties)}`);
  if (!sameSet(gotCollective, wantC)) diffs.push(`collective: got ${JSON.stringify(gotCollective)}, want ${JSON.stringify(wantC)}`);
  const bound = new Set(parsed.parties.flatMap((p) => [...p.terms, p.name]).map(termKey));
  for (const n of c.notParties ?? []) {
    if (!parsed.notParties.includes(n)) diffs.push(`notParties lacks ${JSON.stringify(n)} (got ${JSON.stringify(parsed.notParties)})`);
    if (bound.has(termKey(n))) diffs.push(`${JSON.stringify(n)} is bound to a party`);
  }
  // Issue 16: a signer is a person signing for a party; her job title is a capacity, never a non-party name.
  const signers = parsed.signers ?? [];
  for (const e of c.signers ?? []) {
    const got = signers.find((x) => x.name === e.name);
    if (got === undefined) diffs.push(`signer ${e.name} missing (got ${JSON.stringify(signers.map((x) => x.name))})`);
    else {
      if (e.title !== undefined && got.title !== e.title) diffs.push(`signer ${e.name}: title ${JSON.stringify(got.title)}, want ${JSON.stringify(e.title)}`);
      if (e.capacity !== undefined && got.capacity !== e.capacity) diffs.push(`signer ${e.name}: capacity ${got.capacity}, want ${e.capacity}`);
      if (e.signsFor !== undefined && got.signsFor !== e.signsFor)
        diffs.push(`signer ${e.name}: signs for ${JSON.stringify(got.signsFor)}, want ${JSON.stringify(e.signsFor)}`);
    }
    if (names.includes(e.name) && !want.includes(e.name)) diffs.push(`signer ${e.name} is a party`);
  }
  for (const s of signers)
    if (s.title !== undefined && parsed.notParties.includes(s.title)) diffs.push(`job title ${JSON.stringify(s.title)} listed as a non-party name`);
  // Issue 16 item 8: a declared former or trade name mentioned later is that party, and the explanation says how.
  for (const e of c.resolves ?? []) {
    const r = resolveInContract(parsed, e.mention);
    if (r.party?.name !== e.party || r.alias?.kind !== e.alias)
      diffs.push(
        `mention ${JSON.stringify(e.mention)}: ${r.status} ${JSON.stringify(r.party?.name)} via ${JSON.stringify(r.alias)}, want ${e.party} via its ${e.alias} name`,
      );
    else if (e.alias === 'former' && !r.explanation.includes('former name'))
      diffs.push(`mention ${JSON.stringify(e.mention)}: explanation does not say former name: ${r.explanation}`);
  }
  // Issue 16 item 9: the earlier agreement as the text describes it (the statement itself is evidence, not compared).
  const earlier = (parsed.earlierAgreements ?? []).map(({ statement: _statement, ...rest }) => JSON.stringify(rest));
  const wantEarlier = (c.earlier ?? []).map((e) =>
    JSON.stringify({
      ...(e.title ? { title: e.title } : {}),
      ...(e.date ? { date: e.date } : {}),
      ...(e.reference ? { reference: e.reference } : {}),
      parties: e.parties,
    }),
  );
  if (!sameList(earlier, wantEarlier)) diffs.push(`earlier agreements: got ${JSON.stringify(earlier)}, want ${JSON.stringify(wantEarlier)}`);
  const mentioned = (parsed.mentioned ?? []).map((m) => m.name);
  if (!sameSet(mentioned, c.mentioned ?? [])) diffs.push(`mentioned: got ${JSON.stringify(mentioned)}, want ${JSON.stringify(c.mentioned ?? [])}`);
  return diffs;
}
