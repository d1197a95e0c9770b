/** The human-readable report of `cpreg evaluate`. */
import { countOf } from '../cli/count-words.ts';
import type { EvaluationReport } from './run-evaluation.ts';

const pct = (v: number): string => `${(v * 100).toFixed(2)}%`;

export function formatReport(
  report: EvaluationReport,
  input: { file: string; usableRows: number; problems: unknown[]; filteredOut: number; excludedOut: number; countryQualifiersStripped: number },
): string {
  const lines: string[] = [];
  lines.push(
    `${input.file}: ${countOf(input.usableRows, 'row')} used, ${countOf(input.problems.length, 'row')} with problems (listed above), ${input.filteredOut} filtered out, ${input.excludedOut} excluded, ${input.countryQualifiersStripped} country qualifiers stripped`,
  );
  lines.push(`method ${report.method}: ${report.rows} names, ${report.entities} true entities, ${report.clusters} clusters, ${report.comparisons} comparisons`);
  const pr = (label: string, p: { precision: number; recall: number; f1?: number }): string =>
    `  ${label.padEnd(26)} precision ${pct(p.precision)}  recall ${pct(p.recall)}${p.f1 !== undefined ? `  F1 ${pct(p.f1)}` : ''}`;
  lines.push(pr('pairwise', report.pairwise));
  lines.push(pr('B-cubed', report.bcubed));
  lines.push(`  adjusted Rand index        ${report.ari.toFixed(4)}`);
  lines.push(pr(`pairwise, no acronyms`, report.nonAcronymPairwise));
  lines.push(pr(`pairs with an acronym (${report.acronymRows} rows)`, report.acronymPairwise));
  if (report.outcomes) {
    const o = report.outcomes;
    lines.push(
      `  outcomes (the register's rules): linked ${o.linked}, review ${o.review} (${pct(o.reviewShare)} of records; ${pct(o.reviewTrueMatchShare)} of them true matches), new ${o.new}`,
    );
  }
  if (report.model) lines.push(`  model: links from ${report.model.linkAt} bits, new at or below ${report.model.newAt}; ${report.model.provenance.note}`);
  if (report.blocking) {
    const o = report.blocking.overall;
    lines.push(`  blocking: ${o.candidatePairs} candidate pairs; RR ${o.reductionRatio.toFixed(6)}  PC ${pct(o.pairsCompleteness)}  PQ ${pct(o.pairsQuality)}`);
    for (const [category, c] of Object.entries(report.blocking.byCategory)) {
      lines.push(`    ${category.padEnd(22)} ${String(c.found).padStart(8)} of ${String(c.truePairs).padStart(8)} true pairs  PC ${pct(c.pairsCompleteness)}`);
    }
  }
  lines.push(
    `  seconds: ${Object.entries(report.seconds)
      .map(([k, v]) => `${k} ${v}`)
      .join(', ')}`,
  );
  return `${lines.join('\n')}\n`;
}
