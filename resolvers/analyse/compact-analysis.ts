/**
 * The compact form of a name's analysis, as the register stores it (issue 18): only what cannot be read off the
 * name text cheaply, so that a candidate's stored analysis is a few dozen bytes instead of ~0.5 KB. The bulk of a
 * full analysis is its legal form's ELF code and jurisdiction lists; the compact form names the legal-form entry
 * by its designator key (and the country that narrowed it when that is not the stored one), and rebuildAnalysis
 * narrows the entry's codes again exactly as analyseName does (narrowCodes). `input` is the name itself, `tokens`
 * are `core` split at its spaces, an alternative's tokens likewise.
 *
 * compactAnalysis checks its own work: it rebuilds the analysis from the compact form and compares it, field by
 * field (sameAnalysis: cheaper than comparing JSON texts, which weighed as much as a third of an analysis), with
 * the analysis it was given; when they differ it stores the whole analysis instead
 * (`x`), so a stored analysis always rebuilds to the one analyseName gives. Both are pure.
 */
import type { LegalFormMatch, NameAnalysis } from './types.ts';
import type { LegalFormEntry } from './legal-form-index.ts';
import { legalFormEntry } from './legal-form-index.ts';
import { designatorKey } from './designator-key.ts';
import { narrowCodes, validateCountry } from './narrow-codes.ts';
import { PLACE_JURISDICTIONS } from './place-jurisdictions.ts';

/** A legal form by reference: designator text, entry key, a prefix-form entry, the narrowing country if not the name's. */
interface FormByKey {
  t: string;
  k: string;
  p?: 1;
  /** The country that narrowed the codes when it is not the stored one (a descriptor's place); null for none. */
  j?: string | null;
}

/** A legal form written out, when no entry reproduces it. */
interface FormWritten {
  t: string;
  f: string;
  e: string[];
  u: string[];
}

export interface CompactAnalysis {
  /** core; tokens are its words. */
  c?: string;
  /** normalised, when it is not the core. */
  n?: string;
  l?: FormByKey | FormWritten;
  q?: string[];
  a?: NameAnalysis['aliases'];
  /** alternatives as [kind, core]. */
  v?: [NameAnalysis['alternatives'][number]['kind'], string][];
  r?: NameAnalysis['related'];
  /** partyStatus, when it is not `party`. */
  s?: NameAnalysis['partyStatus'];
  w?: NonNullable<NameAnalysis['partyReason']>;
  k?: NameAnalysis['kind'];
  /** The whole analysis without `input`: the fallback when the compact form does not rebuild it. */
  x?: Omit<NameAnalysis, 'input'>;
}

/** The compact form of `analysis`, the analysis of `name` under `country` (the hint it was analysed with). */
export function compactAnalysis(name: string, country: string | null | undefined, analysis: NameAnalysis): CompactAnalysis {
  const hint = validateCountry(country);
  const out: CompactAnalysis = {};
  if (analysis.core !== '') out.c = analysis.core;
  if (analysis.normalised !== analysis.core) out.n = analysis.normalised;
  if (analysis.legalForm) out.l = formByKey(analysis.legalForm, hint, analysis.qualifiers) ?? writtenForm(analysis.legalForm);
  if (analysis.qualifiers.length > 0) out.q = analysis.qualifiers;
  if (analysis.aliases.length > 0) out.a = analysis.aliases;
  if (analysis.alternatives.length > 0) out.v = analysis.alternatives.map((a) => [a.kind, a.core]);
  if (analysis.related.length > 0) out.r = analysis.related;
  if (analysis.partyStatus !== 'party') out.s = analysis.partyStatus;
  if (analysis.partyReason !== undefined) out.w = analysis.partyReason;
  if (analysis.kind !== 'unknown') out.k = analysis.kind;
  if (sameAnalysis(rebuildAnalysis(name, country, out), analysis)) return out;
  const { input: _input, ...rest } = analysis;
  return { x: rest };
}

/** The analysis a compact form stands for: what analyseName(name, { country }) gave when it was made. */
export function rebuildAnalysis(name: string, country: string | null | undefined, compact: CompactAnalysis): NameAnalysis {
  if (compact.x) return { input: name, ...compact.x };
  const core = compact.c ?? '';
  return {
    input: name,
    normalised: compact.n ?? core,
    core,
    tokens: words(core),
    legalForm: compact.l ? rebuildForm(compact.l, validateCountry(country)) : null,
    qualifiers: compact.q ?? [],
    aliases: compact.a ?? [],
    alternatives: (compact.v ?? []).map(([kind, altCore]) => ({ kind, tokens: words(altCore), core: altCore })),
    related: compact.r ?? [],
    partyStatus: compact.s ?? 'party',
    ...(compact.w === undefined ? {} : { partyReason: compact.w }),
    kind: compact.k ?? 'unknown',
  };
}

function words(core: string): string[] {
  return core === '' ? [] : core.split(' ');
}

function rebuildForm(form: FormByKey | FormWritten, hint: string | undefined): LegalFormMatch {
  if ('e' in form) return { text: form.t, family: form.f, elfCodes: form.e.slice(), jurisdictions: form.u.slice() };
  const entry = legalFormEntry(form.k, form.p === 1 ? 'prefix' : 'suffix');
  // An entry gone from the table (a table change comes with a new ANALYSIS_VERSION): no codes, so no false agreement.
  if (!entry) return { text: form.t, family: '', elfCodes: [], jurisdictions: [] };
  const narrowed = narrowCodes(entry, form.j === undefined ? hint : (form.j ?? undefined));
  return { text: form.t, family: entry.family, elfCodes: narrowed.codes, jurisdictions: narrowed.jurisdictions };
}

function writtenForm(form: LegalFormMatch): FormWritten {
  return { t: form.text, f: form.family, e: form.elfCodes, u: form.jurisdictions };
}

/**
 * The entry and narrowing country that give this legal form. The entry is the designator's key or, for a compound
 * form ("GmbH & Co. KG", whose last designator rules), a suffix (prefix form: a prefix) of it; the country is the
 * hint, none, or a descriptor's place ("a Delaware corporation", kept as a qualifier).
 */
function formByKey(form: LegalFormMatch, hint: string | undefined, qualifiers: readonly string[]): FormByKey | null {
  const key = designatorKey(form.text);
  const countries: (string | undefined)[] = [hint, undefined];
  for (const q of qualifiers) {
    const place = PLACE_JURISDICTIONS.get(q);
    if (place !== undefined && !countries.includes(place)) countries.push(place);
  }
  for (const position of ['suffix', 'prefix'] as const) {
    for (let i = 0; i < key.length; i++) {
      const k = position === 'suffix' ? key.slice(i) : key.slice(0, key.length - i);
      const entry = legalFormEntry(k, position);
      if (!entry || entry.family !== form.family) continue;
      for (const country of countries) {
        if (!sameCodes(entry, country, form)) continue;
        const out: FormByKey = { t: form.text, k };
        if (position === 'prefix') out.p = 1;
        if (country !== hint) out.j = country ?? null;
        return out;
      }
    }
  }
  return null;
}

function sameCodes(entry: LegalFormEntry, country: string | undefined, form: LegalFormMatch): boolean {
  const narrowed = narrowCodes(entry, country);
  return narrowed.codes.join(' ') === form.elfCodes.join(' ') && narrowed.jurisdictions.join(' ') === form.jurisdictions.join(' ');
}

/** Whether two analyses hold the same values in every field analyseName fills (the rebuilt one has no others). */
function sameAnalysis(a: NameAnalysis, b: NameAnalysis): boolean {
  const la = a.legalForm;
  const lb = b.legalForm;
  return (
    a.input === b.input &&
    a.normalised === b.normalised &&
    a.core === b.core &&
    sameList(a.tokens, b.tokens) &&
    (la === null || lb === null
      ? la === lb
      : la.text === lb.text && la.family === lb.family && sameList(la.elfCodes, lb.elfCodes) && sameList(la.jurisdictions, lb.jurisdictions)) &&
    sameList(a.qualifiers, b.qualifiers) &&
    sameRecords(a.aliases, b.aliases, (x, y) => x.kind === y.kind && x.name === y.name) &&
    sameRecords(a.alternatives, b.alternatives, (x, y) => x.kind === y.kind && x.core === y.core && sameList(x.tokens, y.tokens)) &&
    sameRecords(a.related, b.related, (x, y) => x.relation === y.relation && x.name === y.name) &&
    a.partyStatus === b.partyStatus &&
    a.partyReason === b.partyReason &&
    'partyReason' in a === 'partyReason' in b &&
    a.kind === b.kind &&
    Object.keys(a).length === Object.keys(b).length
  );
}

function sameList(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((x, i) => x === b[i]);
}

function sameRecords<T extends object>(a: readonly T[], b: readonly T[], same: (x: T, y: T) => boolean): boolean {
  return a.length === b.length && a.every((x, i) => Object.keys(x).length === Object.keys(b[i]!).length && same(x, b[i]!));
}
