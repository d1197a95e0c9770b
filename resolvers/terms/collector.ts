/** What the parser collects while it reads a contract: party drafts, collective terms, what is not a party; and the bounds on each. */
import { extractJurisdiction } from './extract-jurisdiction.ts';
import { extractIdentifiers } from './extract-identifiers.ts';
import { extractAddress } from './extract-address.ts';
import { analyseCached as analyseName } from './analyse-cached.ts';
import { sameWithTranslatedForm, type NameAnalysis } from '../analyse/index.ts';
import { readsAsName } from './is-plausible-name.ts';
import type { LocatedName } from './locate-name.ts';
import { sameEntityName } from './same-entity-name.ts';

/** Descriptive text kept per party: enough for any phrase seen in practice, bounded for 1 MB inputs. */
export const MAX_DESCRIPTION = 800;
/** No real party has more terms, no real contract more collective terms; the bounds keep 1 MB inputs linear. */
export const MAX_TERMS_PER_PARTY = 50;
export const MAX_COLLECTIVE_TERMS = 100;
/** Descriptive phrases kept per party (preamble, trailing phrase, signature block). */
export const MAX_DESCRIPTIONS = 4;
/** How far after a definition a trailing descriptive phrase may run ("…("Qorv"), a company incorporated…"). */
export const TRAILING_WINDOW = 400;
/** No real contract has more parties; the bound keeps adversarial input linear. Extra names are reported. */
export const MAX_PARTIES = 500;

export interface Draft {
  /** Where the name first appears: parties are reported in text order. */
  position: number;
  /** A form of address stood before the name ("Mr", "Monsieur"). */
  honorific: boolean;
  name: string;
  /** Name plus alias phrases, for the analysis. */
  fullName: string;
  terms: string[];
  termSet: Set<string>;
  label?: string;
  descriptions: string[];
  analysis: NameAnalysis;
}

export interface CollectiveDraft {
  term: string;
  /** Parties covered; null: every party of the contract. */
  members: Draft[] | null;
}

export class Collector {
  readonly drafts: Draft[] = [];
  readonly collectives: CollectiveDraft[] = [];
  readonly notParties: string[] = [];
  /** The last party came from a parties clause: the next one in the list inherits that context. */
  inClause = false;
  /** Names beyond MAX_PARTIES, counted for the warning. */
  overflow = 0;
  overflowTerms = 0;
  overflowCollectives = 0;
  private readonly notPartySet = new Set<string>();
  private readonly byNormalised = new Map<string, Draft>();
  private readonly byCore = new Map<string, Draft[]>();

  constructor(readonly text: string) {}

  /** Adds a located name as a party (or merges it into the same entity seen before); null when implausible. */
  addParty(located: LocatedName, terms: string[], extraDescription: string, label?: string): Draft | null {
    const name = this.text.slice(located.nameStart, located.nameEnd);
    const fullName = this.text.slice(located.nameStart, located.fullEnd);
    const analysis = analyseName(fullName);
    if (!readsAsName(name, analysis)) return null;
    const description = `${this.text.slice(located.descStart, Math.min(located.descEnd, located.descStart + MAX_DESCRIPTION))} ${extraDescription}`.trim();
    if (!located.partyCue && !hasSupport(analysis, description)) return null;
    const existing =
      this.byNormalised.get(analysis.normalised) ??
      (this.byCore.get(analysis.core) ?? []).find((d) => sameEntityName(d.analysis, analysis)) ??
      // "Orvanel Japan Co., Ltd." in the signature block of "Orvanel Japan K.K.": cores differ by the rendered "Co.".
      (analysis.legalForm === null ? undefined : this.drafts.find((d) => sameWithTranslatedForm(d.analysis, analysis)));
    if (existing !== undefined) {
      const d = existing;
      for (const t of terms) this.addTerm(d, t);
      // A party described again and again (a repeated block) adds nothing after the first few phrases.
      if (description.length > 0 && d.descriptions.length < MAX_DESCRIPTIONS) d.descriptions.push(description);
      if (d.label === undefined && label !== undefined) d.label = label;
      return d;
    }
    if (this.drafts.length >= MAX_PARTIES) {
      this.overflow++;
      return null;
    }
    const draft: Draft = {
      position: located.nameStart,
      honorific: located.honorific,
      name,
      fullName,
      terms: [],
      termSet: new Set(),
      descriptions: description.length > 0 ? [description] : [],
      analysis,
    };
    if (label !== undefined) draft.label = label;
    for (const t of terms) this.addTerm(draft, t);
    this.drafts.push(draft);
    if (!this.byNormalised.has(analysis.normalised)) this.byNormalised.set(analysis.normalised, draft);
    const sameCore = this.byCore.get(analysis.core);
    if (sameCore === undefined) this.byCore.set(analysis.core, [draft]);
    else sameCore.push(draft);
    return draft;
  }

  /** Adds a term to a party, once; beyond MAX_TERMS_PER_PARTY the term is counted for the warning. */
  addTerm(d: Draft, term: string): void {
    if (d.termSet.has(term)) return;
    if (d.terms.length >= MAX_TERMS_PER_PARTY) {
      this.overflowTerms++;
      return;
    }
    d.termSet.add(term);
    d.terms.push(term);
  }

  noteNotParty(s: string): void {
    const t = s.trim();
    if (t.length === 0 || this.notPartySet.has(t)) return;
    this.notPartySet.add(t);
    this.notParties.push(t);
  }
}

/** Support for a name found outside a parties clause: a legal form, a person, or a descriptive phrase. */
function hasSupport(analysis: NameAnalysis, description: string): boolean {
  if (analysis.legalForm !== null || analysis.kind === 'person') return true;
  if (description.length === 0) return false;
  const j = extractJurisdiction(description);
  return j !== undefined || extractIdentifiers(description, j).length > 0 || extractAddress(description) !== undefined;
}
