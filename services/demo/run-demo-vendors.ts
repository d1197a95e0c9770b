/**
 * The demo's vendor master: reconciled against the register through services/reconcile (as `cpreg reconcile`
 * does; it reads the register and never changes it), the report written beside the scenario's files, and the
 * findings checked against the vendor master's ground truth (planted duplicates, vendors that never signed,
 * signers missing from the vendor master, look-alikes that must stay apart).
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { readVendorMaster, reconcile, summarise, type Finding } from '../reconcile/reconcile.ts';
import { reportCsv } from '../reconcile/report.ts';
import type { ReconciliationFinding } from '../../resolvers/vocabulary.ts';
import type { Scenario } from './scenario/index.ts';

export const VENDOR_REPORT_FILE = 'vendor-reconciliation.csv';

export interface Recall {
  planted: number;
  found: number;
}

export interface VendorMasterSummary {
  rows: number;
  rejected: number;
  byFinding: Record<ReconciliationFinding, number>;
  /** Relative to the scenario's files directory. */
  reportFile: string;
  seconds: number;
  /** Against the vendor master's ground truth. */
  truth: {
    /** Planted duplicate pairs reported as a pair, and of those with the finding the truth expects. */
    duplicates: Recall & { expectedFinding: number };
    vendorsWithoutContract: Recall;
    /** Counterparties with contracts and no vendor row (found = reported for the register record of that counterparty). */
    counterpartiesWithoutVendor: Recall;
    /** Pairs differing only in legal form or jurisdiction: kept = not reported as same_entity. */
    lookalikes: { planted: number; keptApart: number };
  };
}

/**
 * `registerIdOf` maps a scenario counterparty id to the register's counterparty for it (the one holding most
 * of its mentions), so that findings about register records can be checked against the truth.
 */
export async function reconcileDemo(
  db: Kysely<Database>,
  scenario: Scenario,
  filesDir: string,
  registerIdOf: ReadonlyMap<string, number>,
): Promise<VendorMasterSummary> {
  const started = performance.now();
  const { rows, rejected } = await readVendorMaster(join(filesDir, 'vendor-master.csv'), {});
  const findings = await reconcile(db, rows);
  writeFileSync(join(filesDir, VENDOR_REPORT_FILE), reportCsv(findings));
  const summary = summarise(rows.length + rejected.length, rejected, findings);
  return {
    rows: summary.rowsRead,
    rejected: rejected.length,
    byFinding: summary.byFinding,
    reportFile: VENDOR_REPORT_FILE,
    seconds: (performance.now() - started) / 1000,
    truth: checkAgainstTruth(scenario, findings, registerIdOf),
  };
}

function checkAgainstTruth(scenario: Scenario, findings: readonly Finding[], registerIdOf: ReadonlyMap<string, number>): VendorMasterSummary['truth'] {
  const truth = scenario.vendorMaster.truth;
  const pairKey = (a: string, b: string): string => (a < b ? `${a}|${b}` : `${b}|${a}`);
  const pairs = new Map<string, ReconciliationFinding>();
  for (const f of findings) {
    if (f.vendorRowId !== null && f.pairedVendorRowId !== null) pairs.set(pairKey(f.vendorRowId, f.pairedVendorRowId), f.finding);
  }
  let found = 0;
  let expected = 0;
  for (const d of truth.duplicates) {
    const got = pairs.get(pairKey(d.vendorIds[0], d.vendorIds[1]));
    if (got === undefined) continue;
    found++;
    if (got === d.expectedFinding) expected++;
  }
  const withoutContract = new Set(findings.filter((f) => f.finding === 'vendor_without_contract' && f.pairedVendorRowId === null).map((f) => f.vendorRowId));
  const withoutVendor = new Set(findings.filter((f) => f.finding === 'counterparty_without_vendor').map((f) => f.counterpartyId));
  return {
    duplicates: { planted: truth.duplicates.length, found, expectedFinding: expected },
    vendorsWithoutContract: { planted: truth.vendorsWithoutContract.length, found: truth.vendorsWithoutContract.filter((v) => withoutContract.has(v)).length },
    counterpartiesWithoutVendor: {
      planted: truth.counterpartiesWithoutVendor.length,
      found: truth.counterpartiesWithoutVendor.filter((c) => registerIdOf.has(c) && withoutVendor.has(registerIdOf.get(c)!)).length,
    },
    lookalikes: {
      planted: truth.distinctLookalikes.length,
      keptApart: truth.distinctLookalikes.filter(([a, b]) => pairs.get(pairKey(a, b)) !== 'same_entity').length,
    },
  };
}
