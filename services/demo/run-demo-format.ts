/** The demo summary as a person reads it at a glance (the --json form is the DemoSummary itself). */
import type { DemoSummary } from './summarise-demo.ts';
import type { DemoAccuracy } from './accuracy.ts';

const pct = (x: number): string => `${(x * 100).toFixed(1)}%`;
const num = (n: number | undefined): string => (n ?? 0).toLocaleString('en-US');

export function formatSummary(s: DemoSummary, where: { filesDir?: string } = {}): string {
  const m = s.mentions.byStatus;
  const p = s.contractParties.byStatus;
  const setAside = (b: typeof m): number => (b.not_a_party ?? 0) + (b.unbound_term ?? 0) + (b.collective_term ?? 0);
  const lines = [
    `${s.group} demo (seed ${s.seed})`,
    '',
    `  register        ${num(s.counterparties)} counterparties (the scenario has ${num(s.truthCounterparties)}), ${num(s.ownEntities)} own entities, ${num(s.contracts)} contracts`,
    `  contract parties ${num(s.contractParties.total)} read from the texts: ${num(p.linked)} linked, ${num(p.new)} new, ${num(p.review)} in review, ${num(p.own_entity)} own entity, ${num(setAside(p))} not parties`,
    `  mentions        ${num(s.mentions.total)} ingested: ${num(m.linked)} linked, ${num(m.review)} in review, ${num(m.new)} new, ${num(m.own_entity)} own entity, ` +
      `${num(setAside(m))} not parties (${num(m.not_a_party)} not a party, ${num(m.unbound_term)} unbound term, ${num(m.collective_term)} collective)`,
    `  review queue    ${num(s.reviewQueue)} open item(s)`,
    '',
    '  busiest counterparties',
    ...s.busiest.map(
      (b) =>
        `    #${b.id} ${b.name}${b.jurisdiction ? ` (${b.jurisdiction})` : ''}: ${b.contracts} contracts, ${b.mentions} mentions — ${b.contractIds.join(', ')}${b.contracts > b.contractIds.length ? ', …' : ''}`,
    ),
    ...vendorLines(s, where.filesDir),
    '',
    '  accuracy against the scenario ground truth',
    ...accuracyLines('extracted mentions', s.accuracy.mentions),
    ...accuracyLines(
      `contract parties (${num(s.accuracy.contractParties.found)} of ${num(s.accuracy.contractParties.expected)} true parties read, ${num(s.accuracy.contractParties.extra)} extra)`,
      s.accuracy.contractParties,
    ),
  ];
  return lines.join('\n');
}

function vendorLines(s: DemoSummary, filesDir: string | undefined): string[] {
  const v = s.vendorMaster;
  if (!v) return ['', '  vendor master   not reconciled'];
  const f = v.byFinding;
  const t = v.truth;
  return [
    '',
    `  vendor master   ${num(v.rows)} rows${v.rejected > 0 ? ` (${v.rejected} rejected)` : ''}: ${num(f.matched_with_contracts)} matched to counterparties with contracts, ` +
      `${num(f.vendor_without_contract)} without a contract, ${num(f.counterparty_without_vendor)} contracting counterparties without a vendor row, ` +
      `${num(f.same_entity)} same-entity and ${num(f.same_or_affiliated)} same-or-affiliated pairs`,
    `                  against the truth: ${t.duplicates.found}/${t.duplicates.planted} planted duplicates found (${t.duplicates.expectedFinding} with the expected finding), ` +
      `${t.vendorsWithoutContract.found}/${t.vendorsWithoutContract.planted} vendors that never signed, ` +
      `${t.counterpartiesWithoutVendor.found}/${t.counterpartiesWithoutVendor.planted} signers missing from the vendor master, ` +
      `${t.lookalikes.keptApart}/${t.lookalikes.planted} look-alikes kept apart`,
    `                  report: ${filesDir ? `${filesDir}/` : ''}${v.reportFile}`,
  ];
}

function accuracyLines(title: string, a: DemoAccuracy): string[] {
  const st = a.status;
  const status = (name: string, x: { correct: number; total: number; accuracy: number }): string => `${name} ${x.correct}/${x.total} (${pct(x.accuracy)})`;
  return [
    `    ${title}`,
    `      pairwise  precision ${pct(a.pairwise.precision)}  recall ${pct(a.pairwise.recall)}  F1 ${pct(a.pairwise.f1)}   ` +
      `B-cubed precision ${pct(a.bcubed.precision)}  recall ${pct(a.bcubed.recall)}  F1 ${pct(a.bcubed.f1)}`,
    `      counterparty mentions ${a.counterpartyMentions.total}: ${pct(a.assignedCorrectly)} linked to the right counterparty, ` +
      `${a.counterpartyMentions.review} in review, ${a.counterpartyMentions.other} otherwise`,
    `      status    ${[
      status('own entity', st.own_entity),
      status('not a party', st.not_a_party),
      status('unbound term', st.unbound_term),
      status('collective', st.collective_term),
    ]
      .filter((x) => !x.includes(' 0/0 '))
      .join(', ')}`,
  ];
}
