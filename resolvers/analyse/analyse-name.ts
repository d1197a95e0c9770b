/**
 * analyseName: what one name string says — its core name, legal form, qualifiers, the other names it
 * introduces, and whether it names a party at all. Pure; never throws on any string.
 */
import type { AnalyseHints, LegalFormMatch, NameAnalysis } from './types.ts';
import type { EntityKind } from '../vocabulary.ts';
import { splitAliases } from './split-aliases.ts';
import { alternativeNames } from './alternative-names.ts';
import { matchPrefixForm, matchSuffixForm } from './match-legal-form.ts';
import type { LegalFormSpan } from './match-legal-form.ts';
import { extractQualifiers, trailingGroupStart } from './qualifiers.ts';
import { scanName } from './scan-name.ts';
import { splitDescriptor } from './split-descriptor.ts';
import { PLACE_JURISDICTIONS } from './place-jurisdictions.ts';
import { normaliseName, normaliseTokens } from './normalise-name.ts';
import { partyVerdict } from './party-filter.ts';
import { HONORIFICS, looksLikePersonName, ORGANISATION_WORDS, PERSON_SUFFIXES } from './looks-like-person-name.ts';
import { narrowCodes, validateCountry } from './narrow-codes.ts';
import { isMarkCode, isWordCode } from './fold-char.ts';
import { isForeignWordForm } from './is-foreign-word-form.ts';
import type { NameAlternative } from './alternative-names.ts';

/** Trailing qualifier groups tried before giving up on a suffix form ("X Ltd (Europe) (in liquidation)"). */
const MAX_TRAILING_GROUPS = 3;

export function analyseName(text: string, hints: AnalyseHints = {}): NameAnalysis {
  if (typeof text !== 'string') throw new TypeError('analyseName: text must be a string');
  let country = validateCountry(hints.country);
  const split = splitAliases(text);
  let primary = split.primary;
  const descriptor = splitDescriptor(primary);
  let descriptorText = '';
  if (descriptor) {
    descriptorText = primary;
    primary = primary.slice(0, descriptor.headEnd);
    // "a Delaware corporation" narrows like a hint, unless the caller's hint names another country.
    const place = PLACE_JURISDICTIONS.get(descriptor.place);
    if (place !== undefined && (country === undefined || place.startsWith(country))) country = place;
  }

  let found = findForm(primary, country);
  // "Bank" is a legal form only in Puerto Rico: with a country hint elsewhere such a word is part of the name, not
  // its legal form (a designator of several jurisdictions, or an abbreviation, still counts).
  if (found && country !== undefined && foreignToOneJurisdiction(found.span.entry, country)) found = null;
  // "Brackenridge Fab." with a US hint: "Fab." is a form only in Sweden, so here it shortens a word of the name.
  let wordForm: string[] | null = null;
  if (found && country !== undefined && !found.text && isForeignWordForm(primary.slice(found.span.start, found.span.end), found.span.entry, country)) {
    wordForm = withoutArticle(normaliseTokens(primary.slice(0, found.span.start) + ' ' + primary.slice(found.span.end)));
    found = null;
  }
  if (!found && descriptor?.form) {
    // "Brackenridge Fabrication, a Delaware corporation": the descriptor's form is the name's form.
    found = { span: descriptor.form, trailing: [], trailingFrom: primary.length, text: descriptorText };
  }
  let legalForm: LegalFormMatch | null = null;
  let trailing: string[] = [];
  let coreText = primary;
  if (found) {
    const { span } = found;
    trailing = found.trailing;
    coreText = found.text ? primary : primary.slice(0, span.start) + ' ' + primary.slice(span.end, found.trailingFrom);
    const narrowed = narrowCodes(span.entry, country);
    legalForm = {
      text: (found.text ?? primary).slice(span.start, span.end).trim(),
      family: span.entry.family,
      elfCodes: narrowed.codes,
      jurisdictions: narrowed.jurisdictions,
    };
  }
  let { rest, groups } = extractQualifiers(coreText);
  let restTokens = normaliseTokens(rest);
  let tokens = withoutArticle(restTokens);
  // "The Company", "the Partnership": a designator with nothing left but an article names no one.
  if (legalForm && tokens.length === 0) {
    legalForm = null;
    trailing = [];
    ({ rest, groups } = extractQualifiers(primary));
    restTokens = normaliseTokens(rest);
    tokens = withoutArticle(restTokens);
  }
  const qualifiers: string[] = [];
  for (const g of groups) {
    if (isDefinitionGroup(g)) continue; // ("the Supplier") defines a term: the defined-terms stage reads it
    const q = normaliseName(g);
    if (q !== '') qualifiers.push(q);
  }
  for (const q of trailing) qualifiers.push(q);
  if (descriptor && descriptor.place !== '') qualifiers.push(descriptor.place);
  const verdict = partyVerdict(primary, legalForm ? tokens : restTokens, legalForm !== null);
  const kind: EntityKind =
    verdict.status !== 'party'
      ? 'unknown'
      : legalForm
        ? 'organisation'
        : looksLikePersonName(writtenWords(rest), tokens)
          ? 'person'
          : tokens.some((t) => ORGANISATION_WORDS.has(t))
            ? 'organisation'
            : 'unknown';
  if (kind === 'person') tokens = withoutHonorifics(tokens);
  return {
    input: text,
    normalised: rest === text ? restTokens.join(' ') : normaliseName(text),
    core: tokens.join(' '),
    tokens,
    legalForm,
    qualifiers,
    aliases: split.aliases,
    // An alias is analysed without its own alternatives: one level is enough ("X d/b/a Y" names two spellings).
    alternatives: hints.noAlternatives
      ? []
      : withFormReading(
          alternativeNames(tokens.join(' '), split.aliases, (name) => analyseName(name, { ...(country ? { country } : {}), noAlternatives: true })),
          wordForm,
          tokens,
        ),
    related: split.related,
    partyStatus: verdict.status,
    ...(verdict.reason === null ? {} : { partyReason: verdict.reason }),
    kind,
  };
}

interface Found {
  span: LegalFormSpan;
  /** Normalised trailing qualifier groups stripped before the form was found ("Marlow Credit Union (Bristol)"). */
  trailing: string[];
  trailingFrom: number;
  /** The text the span's offsets refer to when it is not the primary name (a descriptor's form). */
  text?: string;
}

function findForm(primary: string, country: string | undefined): Found | null {
  const scan = scanName(primary);
  let end = primary.length;
  let hi = scan.length;
  const trailing: string[] = [];
  for (let k = 0; k <= MAX_TRAILING_GROUPS; k++) {
    const span = matchSuffixForm(primary, scan, hi, end, country);
    if (span) return { span, trailing, trailingFrom: end };
    const open = trailingGroupStart(primary, end);
    if (open <= 0) break;
    const close = primary.lastIndexOf(')', end);
    const group = primary.slice(open + 1, close);
    const q = isDefinitionGroup(group) ? '' : normaliseName(group);
    if (q !== '') trailing.unshift(q);
    end = open;
    while (hi > 0 && (scan.from[hi - 1] as number) >= end) hi--;
  }
  const prefix = matchPrefixForm(primary, scan, country);
  return prefix ? { span: prefix, trailing: [], trailingFrom: primary.length } : null;
}

/** The reading with a foreign word-like form stripped, kept as an alternative so that matching tries both. */
function withFormReading(alternatives: NameAlternative[], stripped: string[] | null, tokens: readonly string[]): NameAlternative[] {
  if (stripped === null || stripped.length === 0 || stripped.length === tokens.length) return alternatives;
  const core = stripped.join(' ');
  if (alternatives.some((a) => a.core === core)) return alternatives;
  return [...alternatives, { kind: 'without_form', tokens: stripped, core }];
}

function foreignToOneJurisdiction(entry: LegalFormSpan['entry'], country: string): boolean {
  // Abbreviations ("KG", "Co KG") stay forms: they are rarely ordinary words.
  if (entry.abbreviation || entry.distinctJurisdictions.length !== 1) return false;
  const whole = country.slice(0, 2);
  return (entry.distinctJurisdictions[0] as string).slice(0, 2) !== whole;
}

/** The words as written, split like normaliseTokens splits them (for capitalisation checks). */
function writtenWords(text: string): string[] {
  const out: string[] = [];
  let cur = '';
  for (const ch of text) {
    if (ch === "'" || ch === '\u2019') continue;
    const code = ch.codePointAt(0) ?? 0;
    if (isWordCode(code) || isMarkCode(code)) cur += ch;
    else if (cur !== '') {
      out.push(cur);
      cur = '';
    }
  }
  if (cur !== '') out.push(cur);
  return out;
}

/** A parenthesis that defines a term ('("Supplier")', '(hereinafter "Qorv")') rather than naming a place. */
function isDefinitionGroup(group: string): boolean {
  for (let i = 0; i < group.length; i++) {
    const c = group.charCodeAt(i);
    if (c === 0x22 || c === 0x201c || c === 0x201d || c === 0x201e || c === 0xab || c === 0xbb) return true;
  }
  const head = group.trimStart().slice(0, 11).toLowerCase();
  return head === 'hereinafter';
}

/** A leading "The" is not part of the core ("The Orrin Mill Company" ~ "Orrin Mill Company"). */
function withoutArticle(tokens: string[]): string[] {
  return tokens.length > 1 && tokens[0] === 'the' ? tokens.slice(1) : tokens.length === 1 && tokens[0] === 'the' ? [] : tokens;
}

/** "Dr Hanna Velt" and "Hanna Velt" are one person: titles and "Jr"/"PhD" stay out of the core. */
function withoutHonorifics(tokens: string[]): string[] {
  let start = 0;
  let end = tokens.length;
  while (start < end - 2 && HONORIFICS.has(tokens[start] as string)) start++;
  while (end > start + 2 && PERSON_SUFFIXES.has(tokens[end - 1] as string)) end--;
  return start === 0 && end === tokens.length ? tokens : tokens.slice(start, end);
}
