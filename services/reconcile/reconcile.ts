/**
 * Finance reconciliation: links each vendor master row to the register WITHOUT changing it (reads only), and
 * reports findings (RECONCILIATION_FINDINGS):
 *   matched_with_contracts      the vendor is a counterparty that signed contracts;
 *   vendor_without_contract     no counterparty, or one without contracts;
 *   counterparty_without_vendor a contracting counterparty no vendor row matched;
 *   same_entity                 two rows share a strong identifier, or a phone and a similar name;
 *   same_or_affiliated          two rows share only an address, a phone or a bank account: for review.
 * A vendor links to a counterparty through a strong identifier the register holds, or through the register's own
 * candidate scoring (same analysis and comparators as resolution) at or above the link threshold — where a shared
 * phone, e-mail domain or bank account alone never makes the link (affiliates share them).
 */
import { parse } from 'csv-parse';
import { createReadStream } from 'node:fs';
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { holdersOf } from '../../db/queries/identifiers.ts';
import { activeContractCounts, canonicalNameOf, survivorsOf } from '../../db/queries/counterparties.ts';
import { analyse } from '../register/matching/analysis.ts';
import { currentModel } from '../register/matching/model.ts';
import { scoredCandidates } from '../register/matching/candidates.ts';
import { jaroWinkler } from '../../resolvers/compare/index.ts';
import type { ReconciliationFinding } from '../../resolvers/vocabulary.ts';
import { vendorColumns, vendorRow, type VendorMap, type VendorRow } from './vendor-rows.ts';

export interface Finding {
  vendorRowId: string | null;
  vendorName: string | null;
  finding: ReconciliationFinding;
  counterpartyId: number | null;
  canonicalName: string | null;
  contractCount: number | null;
  evidence: string;
  pairedVendorRowId: string | null;
}

export interface ReconcileSummary {
  rowsRead: number;
  rowsRejected: { line: number; reason: string }[];
  matched: number;
  byFinding: Record<ReconciliationFinding, number>;
}

export interface ReconcileResult {
  findings: Finding[];
  summary: ReconcileSummary;
}

/** Rows in one group beyond this are not paired with each other (a shared agent's account on hundreds of rows). */
export const MAX_GROUP_FOR_PAIRS = 50;
export const SIMILAR_WORD = 0.85;
/** Name-comparison levels too weak to link a vendor on (the sweep's rule too). */
const WEAK_NAME_LEVELS = new Set<string | null>(['low', 'none', null]);

export async function readVendorMaster(
  file: string,
  map: VendorMap,
  onRow?: (n: number) => void,
): Promise<{ rows: VendorRow[]; rejected: { line: number; reason: string }[] }> {
  const parser = createReadStream(file).pipe(parse({ bom: true, relax_column_count: true, skip_empty_lines: true, info: true }));
  let header: string[] | undefined;
  let columns: VendorMap = {};
  const rows: VendorRow[] = [];
  const rejected: { line: number; reason: string }[] = [];
  const seen = new Map<string, number>();
  for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
    if (!header) {
      header = record.map((h) => h.trim());
      columns = vendorColumns(header, map);
      continue;
    }
    if (record.length !== header.length) {
      rejected.push({ line: info.lines, reason: `has ${record.length} cells, the header has ${header.length}` });
      continue;
    }
    const cells: Record<string, string> = {};
    header.forEach((h, i) => (cells[h] = record[i]!));
    const row = vendorRow(info.lines, cells, columns);
    if (typeof row === 'string') rejected.push({ line: info.lines, reason: row });
    else if (seen.has(row.id)) rejected.push({ line: info.lines, reason: `vendor id ${row.id} repeats line ${seen.get(row.id)}` });
    else {
      seen.set(row.id, info.lines);
      rows.push(row);
      onRow?.(rows.length);
    }
  }
  return { rows, rejected };
}

function core(name: string, country: string | null): string {
  return analyse(name, country).core;
}

export function similarNames(a: VendorRow, b: VendorRow): boolean {
  const x = core(a.name, a.country);
  const y = core(b.name, b.country);
  if (x === y) return true;
  // ERP name fields cut long names: a cut name is the start of the full one.
  const [short, long] = x.length <= y.length ? [x, y] : [y, x];
  if (short.length >= 15 && long.startsWith(short)) return true;
  // A retyped name: the same words, at most one of them with a typo (Jaro–Winkler ≥ SIMILAR_WORD).
  const xs = x.split(' ');
  const ys = y.split(' ');
  if (xs.length !== ys.length) return false;
  const differing = xs.filter((w, i) => w !== ys[i]);
  return differing.length <= 1 && xs.every((w, i) => w === ys[i] || jaroWinkler(w, ys[i]!) >= SIMILAR_WORD);
}

interface Match {
  counterpartyId: number;
  evidence: string;
}

async function matchVendor(db: Kysely<Database>, row: VendorRow, model: Awaited<ReturnType<typeof currentModel>>['model']): Promise<Match | undefined> {
  if (row.strong.length > 0) {
    const holders = await holdersOf(db, row.strong);
    if (holders.length > 0) {
      const survivors = await survivorsOf(
        db,
        holders.map((h) => h.counterpartyId),
      );
      const h = holders[0]!;
      return { counterpartyId: survivors.get(h.counterpartyId) ?? h.counterpartyId, evidence: `${h.scheme} ${h.value} held by the counterparty` };
    }
  }
  const analysis = analyse(row.name, row.country);
  const candidates = await scoredCandidates(db, { analysis, country: row.country, identifiers: [...row.strong, ...row.contact] }, model);
  for (const c of candidates) {
    const contact = c.pair.explanation.find((e) => e.feature === 'sharedContact');
    const contactWeight = contact?.level === 'shared' ? (contact.weight ?? 0) : 0;
    const decisive = c.pair.override === 'decisive_identifier';
    if (c.pair.override === 'cannot_link') continue;
    // Precision first: without a decisive identifier the names themselves must agree (as the sweep requires),
    // whatever the other features add up to.
    const nameLevel = c.pair.explanation.find((e) => e.feature === 'name')?.level ?? null;
    if (!decisive && WEAK_NAME_LEVELS.has(nameLevel)) continue;
    if (decisive || c.score - contactWeight >= model.linkAt) {
      return {
        counterpartyId: c.counterpartyId,
        evidence: `name "${row.name}" ~ "${c.matchedName}" score ${(c.score - contactWeight).toFixed(2)} (link threshold ${model.linkAt})`,
      };
    }
  }
  return undefined;
}

function pairFindings(rows: VendorRow[]): Finding[] {
  const groups = new Map<string, { what: string; rows: VendorRow[] }>();
  const put = (key: string, what: string, row: VendorRow): void => {
    const g = groups.get(key) ?? { what, rows: [] };
    g.rows.push(row);
    groups.set(key, g);
  };
  for (const row of rows) {
    for (const id of row.strong) put(`s:${id.scheme}:${id.value}`, `same ${id.scheme} ${id.value}`, row);
    for (const id of row.contact) if (id.scheme !== 'email_domain') put(`c:${id.scheme}:${id.value}`, `same ${id.scheme} ${id.value}`, row);
    if (row.addressKey) put(`a:${row.addressKey}`, 'same address', row);
  }
  const pairs = new Map<string, { a: VendorRow; b: VendorRow; strong: boolean; phone: boolean; evidence: string[] }>();
  for (const [key, group] of groups) {
    if (group.rows.length < 2 || group.rows.length > MAX_GROUP_FOR_PAIRS) continue;
    for (let i = 0; i < group.rows.length; i++) {
      for (let j = i + 1; j < group.rows.length; j++) {
        const [a, b] = [group.rows[i]!, group.rows[j]!].sort((x, y) => (x.id < y.id ? -1 : 1)) as [VendorRow, VendorRow];
        const id = `${a.id}\u0000${b.id}`;
        const pair = pairs.get(id) ?? { a, b, strong: false, phone: false, evidence: [] };
        if (key.startsWith('s:')) pair.strong = true;
        if (key.startsWith('c:phone:')) pair.phone = true;
        pair.evidence.push(group.what);
        pairs.set(id, pair);
      }
    }
  }
  const out: Finding[] = [];
  for (const pair of [...pairs.values()].sort((x, y) => (x.a.id < y.a.id ? -1 : x.a.id > y.a.id ? 1 : x.b.id < y.b.id ? -1 : 1))) {
    const similar = similarNames(pair.a, pair.b);
    const same = pair.strong || (pair.phone && similar);
    const evidence = [...pair.evidence, ...(similar ? [`similar names "${pair.a.name}" / "${pair.b.name}"`] : [])].join('; ');
    out.push({
      vendorRowId: pair.a.id,
      vendorName: pair.a.name,
      finding: same ? 'same_entity' : 'same_or_affiliated',
      counterpartyId: null,
      canonicalName: null,
      contractCount: null,
      evidence,
      pairedVendorRowId: pair.b.id,
    });
  }
  return out;
}

export async function reconcile(db: Kysely<Database>, rows: VendorRow[], onProgress?: (done: number) => void): Promise<Finding[]> {
  const { model } = await currentModel(db);
  const counts = await activeContractCounts(db);
  const findings: Finding[] = [];
  const matchedCounterparties = new Set<number>();
  const names = new Map<number, string>();
  const nameOf = async (id: number): Promise<string> => {
    if (!names.has(id)) {
      names.set(id, (await canonicalNameOf(db, id)) ?? '');
    }
    return names.get(id)!;
  };
  let done = 0;
  for (const row of rows) {
    const match = await matchVendor(db, row, model);
    const problems = row.problems.length > 0 ? `; not used: ${row.problems.join('; ')}` : '';
    if (match) {
      matchedCounterparties.add(match.counterpartyId);
      const contracts = counts.get(match.counterpartyId) ?? 0;
      findings.push({
        vendorRowId: row.id,
        vendorName: row.name,
        finding: contracts > 0 ? 'matched_with_contracts' : 'vendor_without_contract',
        counterpartyId: match.counterpartyId,
        canonicalName: await nameOf(match.counterpartyId),
        contractCount: contracts,
        evidence: `${match.evidence}${contracts === 0 ? '; the counterparty has no contract' : ''}${problems}`,
        pairedVendorRowId: null,
      });
    } else {
      findings.push({
        vendorRowId: row.id,
        vendorName: row.name,
        finding: 'vendor_without_contract',
        counterpartyId: null,
        canonicalName: null,
        contractCount: 0,
        evidence: `no counterparty in the register${problems}`,
        pairedVendorRowId: null,
      });
    }
    onProgress?.(++done);
  }
  const pairs = pairFindings(rows);
  // A row that is the same supplier as a matched row (same_entity) is that counterparty's vendor row too.
  const byVendor = new Map(findings.filter((f) => f.vendorRowId !== null).map((f) => [f.vendorRowId!, f]));
  for (const pair of pairs) {
    if (pair.finding !== 'same_entity') continue;
    const a = byVendor.get(pair.vendorRowId!);
    const b = byVendor.get(pair.pairedVendorRowId!);
    for (const [from, to] of [
      [a, b],
      [b, a],
    ] as const) {
      if (!from || !to || from.counterpartyId === null || to.counterpartyId !== null) continue;
      to.counterpartyId = from.counterpartyId;
      to.canonicalName = from.canonicalName;
      to.contractCount = from.contractCount;
      to.finding = from.finding;
      to.evidence = `same supplier as vendor row ${from.vendorRowId} (${pair.evidence}); ${from.evidence}`;
      matchedCounterparties.add(from.counterpartyId);
    }
  }
  for (const [counterpartyId, contracts] of [...counts].sort((a, b) => a[0] - b[0])) {
    if (matchedCounterparties.has(counterpartyId)) continue;
    findings.push({
      vendorRowId: null,
      vendorName: null,
      finding: 'counterparty_without_vendor',
      counterpartyId,
      canonicalName: await nameOf(counterpartyId),
      contractCount: contracts,
      evidence: `${contracts} contract(s), no vendor row matched`,
      pairedVendorRowId: null,
    });
  }
  findings.push(...pairs);
  return findings;
}

export function summarise(rowsRead: number, rejected: { line: number; reason: string }[], findings: Finding[]): ReconcileSummary {
  const byFinding = { matched_with_contracts: 0, vendor_without_contract: 0, counterparty_without_vendor: 0, same_entity: 0, same_or_affiliated: 0 } as Record<
    ReconciliationFinding,
    number
  >;
  for (const f of findings) byFinding[f.finding]++;
  return {
    rowsRead,
    rowsRejected: rejected,
    matched: findings.filter((f) => f.vendorRowId !== null && f.counterpartyId !== null && f.pairedVendorRowId === null).length,
    byFinding,
  };
}
