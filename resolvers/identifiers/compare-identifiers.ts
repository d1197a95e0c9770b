/**
 * What two parties' identifiers say about them being the same legal entity.
 *
 * - decisive: an equal, valid strong identifier (LEI, VAT, registration numbers) and nothing against it.
 * - cannotLink: the two hold different valid values in a scheme where an entity has exactly one value:
 *   different LEIs, different numbers in one registration scheme, different VAT numbers of one country,
 *   different entries of one German register court and type.
 * - conflicting: both of the above at once (e.g. same VAT number, different LEIs: a VAT group, or a data
 *   error). `decisive` is then false: such a pair needs a person.
 * - sharedWeak: shared phone, e-mail/web domain, IBAN or other labelled identifier. This means "same or
 *   affiliated" (affiliates share switchboards, domains and bank accounts): review, never merge on it alone.
 *   Free-mail domains are never evidence.
 *
 * Identifiers are normalised here again (normaliseIdentifier is idempotent), so raw input is safe; invalid
 * ones are left out and listed in `ignored` and in the explanation, never silently.
 */
import { STRONG_SCHEMES, type Identifier, type IdentifierScheme } from '../vocabulary.ts';
import { isFreeMailDomain } from './contact.ts';
import { splitDeRegister } from './de-register.ts';
import { normaliseIdentifier } from './normalise-identifier.ts';
import { normaliseAddress } from './address.ts';
import type { NormaliseOptions, NormaliseResult } from './types.ts';
import { sirenFromFrenchVat } from './vat.ts';

export interface IdentifierEvidence {
  /** An identifier scheme, or 'address' for a shared postal address (options.addresses). */
  scheme: IdentifierScheme | 'address';
  value: string;
  label?: string;
  /** Set when the value was derived from another identifier (e.g. the SIREN inside a French VAT number). */
  derivedFrom?: Identifier;
}

export interface CompareIdentifiersOptions extends NormaliseOptions {
  /** Postal addresses of the two sides: an equal address (after folding) is weak evidence too. */
  addresses?: { a?: string | null; b?: string | null };
}

export interface DifferingIdentifiers {
  scheme: IdentifierScheme | 'address';
  a: string[];
  b: string[];
}

export interface IgnoredIdentifier {
  side: 'a' | 'b';
  identifier: Identifier;
  reason: string;
}

export interface IdentifierComparison {
  decisive: boolean;
  cannotLink: boolean;
  conflicting: boolean;
  equalStrong: IdentifierEvidence[];
  differingStrong: DifferingIdentifiers[];
  sharedWeak: IdentifierEvidence[];
  ignored: IgnoredIdentifier[];
  explanation: string[];
}

interface Side {
  strong: Map<IdentifierScheme | 'address', IdentifierEvidence[]>;
  weak: Map<string, IdentifierEvidence>;
}

/** Key under which weak evidence is shared: e-mail and web domains form one pool ("qorv.example" either way). */
function weakKey(e: IdentifierEvidence): string {
  if (e.scheme === 'email_domain' || e.scheme === 'web_domain') return `domain:${e.value}`;
  if (e.scheme === 'other') return `other:${e.label ?? ''}:${e.value}`;
  return `${e.scheme}:${e.value}`;
}

/**
 * Normalisation results by scheme, value, label and default country: a record's identifiers meet many candidates,
 * and phone parsing is the costly part. Bounded; emptied when full. Results do not depend on it.
 */
const memo = new Map<string, NormaliseResult>();
const MEMO_LIMIT = 50_000;

function normaliseMemo(identifier: Identifier, options: NormaliseOptions): NormaliseResult {
  const key = `${identifier.scheme}\u0000${identifier.value}\u0000${identifier.label ?? ''}\u0000${options.defaultCountry ?? ''}`;
  let result = memo.get(key);
  if (result === undefined) {
    if (memo.size >= MEMO_LIMIT) memo.clear();
    result = normaliseIdentifier(identifier, options);
    memo.set(key, result);
  }
  return result;
}

function collect(side: 'a' | 'b', identifiers: readonly Identifier[], options: NormaliseOptions, ignored: IgnoredIdentifier[]): Side {
  const strong = new Map<IdentifierScheme | 'address', IdentifierEvidence[]>();
  const weak = new Map<string, IdentifierEvidence>();
  const addStrong = (e: IdentifierEvidence): void => {
    const list = strong.get(e.scheme) ?? [];
    if (!list.some((x) => x.value === e.value)) list.push(e);
    strong.set(e.scheme, list);
  };
  for (const identifier of identifiers) {
    const result = normaliseMemo(identifier, options);
    if (!result.ok) {
      ignored.push({ side, identifier, reason: result.reason });
      continue;
    }
    const id = result.identifier;
    if (STRONG_SCHEMES.has(id.scheme)) {
      addStrong({ scheme: id.scheme, value: id.value });
      const siren = id.scheme === 'vat' ? sirenFromFrenchVat(id.value) : null;
      if (siren) addStrong({ scheme: 'fr_siren', value: siren, derivedFrom: { ...id } });
    } else if (id.scheme === 'email_domain' && isFreeMailDomain(id.value)) {
      ignored.push({ side, identifier, reason: `e-mail domain ${id.value} is a free-mail provider: never evidence` });
    } else {
      const e: IdentifierEvidence = id.label === undefined ? { scheme: id.scheme, value: id.value } : { scheme: id.scheme, value: id.value, label: id.label };
      weak.set(weakKey(e), e);
    }
  }
  return { strong, weak };
}

/** Values that can clash: VAT numbers only within one country prefix, register entries only within one court. */
function clashGroup(e: IdentifierEvidence): string {
  if (e.scheme === 'vat') return e.value.slice(0, 2);
  if (e.scheme === 'de_register') {
    const { court, entry } = splitDeRegister(e.value);
    return `${court} ${entry.split(' ')[0]}`;
  }
  return '';
}

function describe(e: IdentifierEvidence): string {
  return e.derivedFrom ? `${e.scheme} ${e.value} (from ${e.derivedFrom.scheme} ${e.derivedFrom.value})` : `${e.scheme} ${e.value}`;
}

export function compareIdentifiers(a: readonly Identifier[], b: readonly Identifier[], options: CompareIdentifiersOptions = {}): IdentifierComparison {
  const ignored: IgnoredIdentifier[] = [];
  const normaliseOptions: NormaliseOptions = options.defaultCountry === undefined ? {} : { defaultCountry: options.defaultCountry };
  const left = collect('a', a, normaliseOptions, ignored);
  const right = collect('b', b, normaliseOptions, ignored);
  const addressA = options.addresses?.a ? normaliseAddress(options.addresses.a) : '';
  const addressB = options.addresses?.b ? normaliseAddress(options.addresses.b) : '';
  if (addressA.length > 0) left.weak.set(`address:${addressA}`, { scheme: 'address', value: addressA });
  if (addressB.length > 0) right.weak.set(`address:${addressB}`, { scheme: 'address', value: addressB });
  const equalStrong: IdentifierEvidence[] = [];
  const differingStrong: DifferingIdentifiers[] = [];
  const explanation: string[] = [];

  for (const [scheme, valuesA] of left.strong) {
    const valuesB = right.strong.get(scheme);
    if (!valuesB) continue;
    const equal = valuesA.filter((x) => valuesB.some((y) => y.value === x.value));
    equalStrong.push(...equal);
    for (const e of equal) explanation.push(`same ${describe(e)}: decisive for the same legal entity`);
    // Different values clash only when they are in the same group and that group has no equal value.
    const groups = new Set(valuesA.map(clashGroup).filter((g) => valuesB.some((y) => clashGroup(y) === g)));
    const clashing = [...groups].filter((g) => !equal.some((e) => clashGroup(e) === g));
    if (clashing.length > 0) {
      const pick = (list: IdentifierEvidence[]): string[] => list.filter((x) => clashing.includes(clashGroup(x))).map((x) => x.value);
      const entry = { scheme, a: pick(valuesA), b: pick(valuesB) };
      differingStrong.push(entry);
      explanation.push(`different ${scheme}: ${entry.a.join(', ')} vs ${entry.b.join(', ')}: cannot be the same legal entity`);
    }
  }

  // A company's ABN is two check digits followed by its ACN (ATO practice, from memory); the converse does not
  // hold (not every ABN holder is a company), so this can only add agreement, never a cannot-link.
  for (const [acnSide, abnSide] of [
    [left, right],
    [right, left],
  ] as const) {
    for (const acn of acnSide.strong.get('au_acn') ?? []) {
      const abn = (abnSide.strong.get('au_abn') ?? []).find((x) => x.value.slice(2) === acn.value);
      if (abn && !equalStrong.some((e) => e.scheme === 'au_acn' && e.value === acn.value)) {
        equalStrong.push({ scheme: 'au_acn', value: acn.value, derivedFrom: { scheme: 'au_abn', value: abn.value } });
        explanation.push(`ACN ${acn.value} is the last nine digits of ABN ${abn.value}: decisive for the same legal entity`);
      }
    }
  }

  const sharedWeak: IdentifierEvidence[] = [];
  for (const [key, e] of left.weak) {
    if (right.weak.has(key)) {
      sharedWeak.push(e);
      explanation.push(`shared ${e.scheme === 'other' ? `${e.label}` : e.scheme} ${e.value}: same or affiliated, review only`);
    }
  }
  for (const x of ignored) explanation.push(`ignored on side ${x.side}: ${x.reason}`);

  const cannotLink = differingStrong.length > 0;
  const conflicting = cannotLink && equalStrong.length > 0;
  if (conflicting) explanation.push('equal and different strong identifiers at once: needs a person');
  return { decisive: equalStrong.length > 0 && !cannotLink, cannotLink, conflicting, equalStrong, differingStrong, sharedWeak, ignored, explanation };
}
