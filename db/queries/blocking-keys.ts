/**
 * Candidate lookup through blocking keys. Each key contributes at most `perKey` (200) counterparties (an index range
 * scan on the primary key), so a very common key cannot flood the candidate list. Candidates are ranked as
 * db/queries/candidate-rank.ts says: the rarity of the keys they share, then country and closeness of name, so which
 * candidates fill the limit is not an accident of ids.
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';
import { id } from './util.ts';
import { KEY_COUNT_CAP, registerSizeSql, tokenDf } from './rarity-counts.ts';
import { CANDIDATE_POOL, keyGroupSql, rarityOf, SIMILARITY_WEIGHT } from './candidate-rank.ts';

export interface CandidateDetail {
  counterpartyId: number;
  canonicalName: string;
  jurisdiction: string | null;
  /** Each name with its stored analysis (migrations/20261205180000_counterparty_name_analysis.ts), null when it has none. */
  names: { name: string; kind: string; stored: StoredNameAnalysis | null }[];
  identifiers: { scheme: string; value: string; label: string | null }[];
}

/** A stored analysis as read (its compact form, resolvers/analyse/compact-analysis.ts): the caller decides whether its version and country are current. */
export interface StoredNameAnalysis {
  analysis: unknown;
  version: number;
  country: string | null;
}

type NameCell = [string, string, unknown, number | null, string | null];

/**
 * Candidates by blocking keys and by identifiers, with their names and identifiers, in ONE statement (one round
 * trip, one consistent snapshot). Keys and identifiers only ever belong to active counterparties (a merge moves
 * them), so no merged counterparty comes back.
 */
export async function candidateDetails(
  db: Queryable,
  keys: string[],
  identifiers: { scheme: string; value: string }[],
  options: { perKey?: number; limit?: number; country?: string | null; text?: string | null } = {},
): Promise<CandidateDetail[]> {
  // One probe of the batch statement: the single and the batch answers cannot drift apart.
  return (await candidateDetailsBatch(db, [{ keys, identifiers, country: options.country ?? null, text: options.text ?? null }], options))[0]!;
}

/**
 * Candidates of many probes in ONE statement (candidateDetails is its one-probe case): per probe, the `limit`
 * best ranked as candidate-rank.ts says (each key contributing at most `perKey` counterparties), the identifier
 * holders added, active only; each probe's list in rank order. Each distinct key is looked up once, and each candidate's names and
 * identifiers are read once however many probes share it.
 *
 * A common key (more holders than `perKey`, or its names at the count cap) is looked up for a probe only when none
 * of the probe's other keys has a holder. Its lookup would stop at `perKey` holders in index order, the lowest ids,
 * so which of its holders it brought was an accident of ids, not evidence; and on a large register such keys were
 * most of the rows a lookup grouped and sorted (issue 18: the candidate step of a single resolve).
 */
export async function candidateDetailsBatch(
  db: Queryable,
  probes: CandidateProbe[],
  options: { perKey?: number; limit?: number } = {},
): Promise<CandidateDetail[][]> {
  return (await candidateQuery(db, probes, options, null)).details;
}

/** A probe of the candidate lookup: its blocking keys, identifiers, country and normalised name (for the ranking). */
export interface CandidateProbe {
  keys: string[];
  identifiers: { scheme: string; value: string }[];
  country?: string | null;
  text?: string | null;
}

/**
 * candidateDetailsBatch and, in the same statement (one round trip fewer for a single resolve), the token counts of
 * `tokens` and of every word of the candidates' stored names (their `normalised` text split at spaces: a superset of
 * the tokens their analyses give), with the register's size, read as tokenCountsAndSize reads them
 * (db/queries/rarity-counts.ts, the same expression). Answers null counts when the probes have nothing to look up.
 */
export async function candidateDetailsWithTokenCounts(
  db: Queryable,
  probes: CandidateProbe[],
  options: { perKey?: number; limit?: number },
  read: { tokens: readonly string[]; cap: number },
): Promise<{ details: CandidateDetail[][]; counts: { counts: Map<string, number>; size: number } | null }> {
  return candidateQuery(db, probes, options, read);
}

async function candidateQuery(
  db: Queryable,
  probes: CandidateProbe[],
  options: { perKey?: number; limit?: number },
  read: { tokens: readonly string[]; cap: number } | null,
): Promise<{ details: CandidateDetail[][]; counts: { counts: Map<string, number>; size: number } | null }> {
  const out: CandidateDetail[][] = probes.map(() => []);
  const [countryProbe, countries] = presentValues(probes, (probe) => probe.country);
  const [textProbe, texts] = presentValues(probes, (probe) => probe.text);
  const keyProbe: number[] = [];
  const keys: string[] = [];
  const idProbe: number[] = [];
  const schemes: string[] = [];
  const values: string[] = [];
  probes.forEach((probe, p) => {
    for (const key of probe.keys) {
      keyProbe.push(p);
      keys.push(key);
    }
    for (const identifier of probe.identifiers) {
      idProbe.push(p);
      schemes.push(identifier.scheme);
      values.push(identifier.value);
    }
  });
  if (keys.length === 0 && schemes.length === 0) return { details: out, counts: null };
  const perKey = options.perKey ?? 200;
  const result = await sql<{
    kind: 'c' | 't' | 's';
    ps: (string | number)[] | string;
    rns: (string | number)[] | string;
    id: string | number;
    canonical_name: string;
    jurisdiction: string | null;
    names: NameCell[] | string;
    identifiers: [string, string, string | null][] | string;
    token: string | null;
    df: string | number | null;
  }>`
    WITH q AS (
      SELECT p, key FROM unnest(${sql.val(keyProbe)}::int[], ${sql.val(keys)}::text[]) AS q(p, key)
    ), dk AS (
      SELECT dk.key, ${rarityOf('kc.names')} AS rarity,
        coalesce(kc.names, 0) > 0 AS held,
        (coalesce(kc.names, 0) >= ${KEY_COUNT_CAP} OR coalesce(kc.counterparties, 0) > ${perKey}) AS common
      FROM (SELECT DISTINCT key FROM q) dk LEFT JOIN blocking_key_count kc ON kc.key = dk.key
    ), qk AS (
      -- Per probe, the keys looked up: a common key only when no other key of the probe has a holder (see above).
      SELECT p, key FROM (
        SELECT q.p, q.key, dk.common, bool_or(dk.held AND NOT dk.common) OVER (PARTITION BY q.p) AS selective
        FROM q JOIN dk ON dk.key = q.key
      ) x
      WHERE NOT common OR NOT selective
    ), hits AS (
      SELECT dk.key, dk.rarity, c.counterparty_id
      FROM dk
      CROSS JOIN LATERAL (
        SELECT DISTINCT b.counterparty_id FROM blocking_key b WHERE b.key = dk.key LIMIT ${perKey}
      ) c
      WHERE dk.key IN (SELECT key FROM qk)
    ), grouped AS (
      -- A word's t: key and the s: key of its stem are one piece of evidence, not two: each group (see keyGroupSql)
      -- counts once, at its rarest shared key.
      SELECT q.p, h.counterparty_id, max(h.rarity) AS rarity
      FROM qk q JOIN hits h ON h.key = q.key
      GROUP BY q.p, h.counterparty_id, ${keyGroupSql('q.key')}
    ), ranked AS (
      SELECT p, counterparty_id, row_number() OVER (PARTITION BY p ORDER BY sum(rarity) DESC, count(*) DESC, counterparty_id) AS rn, sum(rarity) AS rarity
      FROM grouped
      GROUP BY p, counterparty_id
    ), pt AS (
      SELECT p, text FROM unnest(${sql.val(textProbe)}::int[], ${sql.val(texts)}::text[]) AS pt(p, text)
    ), pc AS (
      SELECT p, country FROM unnest(${sql.val(countryProbe)}::int[], ${sql.val(countries)}::text[]) AS pc(p, country)
    ), by_key AS (
      -- The POOL rarest, then: those whose country does not conflict with the probe's first (a conflict costs a pair
      -- far more than any key says: resolvers/score, jurisdiction conflicting), then by their rarity plus how close
      -- their closest name is to the probe's (trigram similarity, SIMILARITY_WEIGHT per unit). The closeness ranks
      -- a typo variant whose distinctive word shares no key above the names that share only its common words.
      SELECT p, counterparty_id, rn FROM (
        SELECT r.p, r.counterparty_id, row_number() OVER (PARTITION BY r.p ORDER BY
          (pc.country IS NOT NULL AND cp.jurisdiction IS NOT NULL AND split_part(cp.jurisdiction, '-', 1) <> split_part(pc.country, '-', 1)),
          r.rarity + coalesce(round(${SIMILARITY_WEIGHT} * (
            SELECT max(similarity(n.normalised, pt.text)) FROM counterparty_name n WHERE n.counterparty_id = r.counterparty_id))::bigint, 0) DESC,
          r.rn) AS rn
        FROM ranked r JOIN counterparty cp ON cp.id = r.counterparty_id LEFT JOIN pc ON pc.p = r.p LEFT JOIN pt ON pt.p = r.p
        WHERE r.rn <= ${CANDIDATE_POOL}
      ) x
      WHERE rn <= ${options.limit ?? 50}
    ), pairs AS (
      SELECT p, counterparty_id, rn FROM by_key
      UNION ALL
      SELECT ip.p, i.counterparty_id, NULL FROM counterparty_identifier i
      JOIN unnest(${sql.val(idProbe)}::int[], ${sql.val(schemes)}::text[], ${sql.val(values)}::text[]) AS ip(p, scheme, value)
        ON i.scheme = ip.scheme AND i.value = ip.value
    ), cps AS (
      SELECT counterparty_id, array_agg(p ORDER BY p) AS ps, array_agg(rn ORDER BY p) AS rns
      FROM (SELECT p, counterparty_id, coalesce(min(rn), ${UNRANKED})::int AS rn FROM pairs GROUP BY p, counterparty_id) x
      GROUP BY counterparty_id
    ), found AS (
      SELECT cps.ps, cps.rns, cp.id, cp.canonical_name, cp.jurisdiction,
        (SELECT coalesce(json_agg(json_build_array(n.name, n.kind, a.analysis, a.analysis_version, a.country) ORDER BY n.id), '[]'::json)
          FROM counterparty_name n LEFT JOIN counterparty_name_analysis a ON a.name_id = n.id WHERE n.counterparty_id = cp.id) AS names,
        (SELECT coalesce(json_agg(json_build_array(i.scheme, i.value, i.label) ORDER BY i.id), '[]'::json) FROM counterparty_identifier i WHERE i.counterparty_id = cp.id) AS identifiers
      FROM cps JOIN counterparty cp ON cp.id = cps.counterparty_id
      WHERE cp.status = 'active'
    )
    SELECT 'c' AS kind, f.*, NULL::text AS token, NULL::bigint AS df FROM found f
    ${read ? tokenCountRows(read) : sql``}
    ORDER BY kind, id`.execute(db);
  const ranks = probes.map(() => new Map<CandidateDetail, number>());
  const counts = read ? { counts: new Map<string, number>(), size: 0 } : null;
  for (const r of result.rows) {
    if (r.kind === 's') counts!.size = Number(r.df ?? 0);
    if (r.kind === 't') counts!.counts.set(r.token!, Number(r.df ?? 0));
    if (r.kind !== 'c') continue;
    const detail = detailOf(r);
    const rns = parseIntArray(r.rns);
    parseIntArray(r.ps).forEach((p, i) => {
      out[p]!.push(detail);
      ranks[p]!.set(detail, rns[i]!);
    });
  }
  // Rows come by id; each probe's list is put in its rank order (identifier holders without a key last, by id).
  out.forEach((list, p) => list.sort((x, y) => ranks[p]!.get(x)! - ranks[p]!.get(y)! || x.counterpartyId - y.counterpartyId));
  return { details: out, counts };
}

/** The token-count rows appended to the candidates (see candidateDetailsWithTokenCounts): kind 't' per token, 's' the size. */
function tokenCountRows(read: { tokens: readonly string[]; cap: number }) {
  return sql`UNION ALL
    SELECT 't', NULL, NULL, NULL, NULL, NULL, NULL, NULL, t.token, ${tokenDf(read.cap)}
    FROM (
      SELECT DISTINCT token FROM (
        SELECT unnest(${sql.val([...read.tokens])}::text[]) AS token
        UNION ALL
        SELECT regexp_split_to_table(n.normalised, ' ') FROM counterparty_name n WHERE n.counterparty_id IN (SELECT id FROM found)
      ) u WHERE token <> ''
    ) t
    LEFT JOIN blocking_key_count c ON c.key = 't:' || t.token
    UNION ALL
    SELECT 's', NULL, NULL, NULL, NULL, NULL, NULL, NULL, NULL, ${registerSizeSql()}`;
}

/** The rank of a candidate found by an identifier only (after every candidate found by keys). */
const UNRANKED = 2_147_483_647;

/** int[] as both drivers answer it (an array, or PostgreSQL's text form '{1,2}'). */
function parseIntArray(value: (string | number)[] | string): number[] {
  if (Array.isArray(value)) return value.map(Number);
  const inner = value.replace(/^\{|\}$/g, '');
  return inner.length === 0 ? [] : inner.split(',').map(Number);
}

function detailOf(r: {
  id: string | number;
  canonical_name: string;
  jurisdiction: string | null;
  names: NameCell[] | string;
  identifiers: [string, string, string | null][] | string;
}): CandidateDetail {
  const names = (typeof r.names === 'string' ? JSON.parse(r.names) : r.names) as NameCell[];
  const ids = (typeof r.identifiers === 'string' ? JSON.parse(r.identifiers) : r.identifiers) as [string, string, string | null][];
  return {
    counterpartyId: id(r.id),
    canonicalName: r.canonical_name,
    jurisdiction: r.jurisdiction,
    names: names.map(([name, kind, analysis, version, country]) => ({
      name,
      kind,
      stored:
        analysis === null || analysis === undefined || version === null
          ? null
          : { analysis: typeof analysis === 'string' ? (JSON.parse(analysis) as unknown) : analysis, version, country },
    })),
    identifiers: ids.map(([scheme, value, label]) => ({ scheme, value, label })),
  };
}

/** The probes that have a value (their indexes) and those values, as two parallel arrays for unnest. */
function presentValues(probes: readonly CandidateProbe[], pick: (probe: CandidateProbe) => string | null | undefined): [number[], string[]] {
  const at: number[] = [];
  const values: string[] = [];
  probes.forEach((probe, p) => {
    const value = pick(probe);
    if (!value) return;
    at.push(p);
    values.push(value);
  });
  return [at, values];
}
