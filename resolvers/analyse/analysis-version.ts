/**
 * The version of name analysis: what analyseName gives for a name and, through it, the blocking keys of a stored
 * name. The register stores each name's analysis and keys with the version that made them
 * (migrations/20261205180000_counterparty_name_analysis.ts) and re-analyses only names of another version, so this
 * number goes up with EVERY change to the output of analyseName (normalisation, legal forms, qualifiers, aliases,
 * party status, alternatives), to the keys taken from it (resolvers/block) or to its stored form (compact-analysis.ts,
 * including the legal-form table its references point into). `cpreg migrate reanalyse` then
 * rewrites the stored analyses and keys of an existing register; `cpreg verify` lists the names still to do.
 *
 * 1: the analysis when stored analyses were introduced.
 * 2: ae/oe/ue no longer folded at a word's end or before a final l/s ("Samuel Blue" stays, normalise-name.ts).
 * 3: the same analysis, stored in its compact form (compact-analysis.ts, migrations/20261205210000_compact_name_analysis.ts).
 */
export const ANALYSIS_VERSION = 3;
