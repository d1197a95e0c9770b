/**
 * The legal-form index built from elf-table.json: designators in a trie of their REVERSED keys, so that a
 * name is matched by walking its letter stream from the end (suffix forms), and a forward trie for the
 * forms that stand first (prefix forms). One walk per name, no alternation regex over thousands of forms.
 */
import elfTable from './elf-table.json' with { type: 'json' };

export interface LegalFormEntry {
  /** Designator key (folded letters and digits). */
  key: string;
  family: string;
  /** Abbreviation ("a"), full name ("n"), or both. */
  abbreviation: boolean;
  name: boolean;
  /** ELF codes, sorted; jurisdictions[i] is the jurisdiction of codes[i]. */
  codes: string[];
  jurisdictions: string[];
  /** The distinct jurisdictions, in the order of first appearance in `jurisdictions`. */
  distinctJurisdictions: string[];
}

export interface TrieNode {
  next: Map<number, TrieNode> | undefined;
  entry: LegalFormEntry | undefined;
}

interface RawTable {
  about: string;
  codes: Record<string, string>;
  inactive: string[];
  forms: Record<string, string[]>;
}

/**
 * Countries whose designators stand before the name: Russian-style abbreviations (ООО «…», UAB …, SIA …,
 * AS …) and, for Poland, the full names that open a name ("Przedsiębiorstwo Państwowe …", "Fundacja …").
 * Common practice.
 */
const PREFIX_COUNTRIES_ALL: ReadonlySet<string> = new Set(['RU', 'BY', 'UA', 'KZ', 'KG', 'UZ', 'TJ', 'AM', 'AZ', 'GE', 'MD', 'LT', 'LV', 'EE']);
const PREFIX_COUNTRIES_NAMES: ReadonlySet<string> = new Set(['PL']);

/** Whether designators of this jurisdiction's forms stand first; `name` for full names, else abbreviations. */
export function isPrefixJurisdiction(jurisdiction: string, name: boolean): boolean {
  const country = countryOf(jurisdiction);
  return PREFIX_COUNTRIES_ALL.has(country) || (name && PREFIX_COUNTRIES_NAMES.has(country));
}

/** Designators of one letter ("A", "S") are too ambiguous to strip from arbitrary names. */
const MIN_KEY_LENGTH = 2;

export interface LegalFormIndex {
  suffix: TrieNode;
  prefix: TrieNode;
  entries: Map<string, LegalFormEntry>;
  inactive: ReadonlySet<string>;
  jurisdictionOf: (code: string) => string | undefined;
}

let built: LegalFormIndex | undefined;

export function legalFormIndex(): LegalFormIndex {
  if (!built) built = buildIndex(elfTable as unknown as RawTable);
  return built;
}

/** The entry of a designator key: the suffix form (every code), or the prefix form (the prefix countries' codes). */
export function legalFormEntry(key: string, position: 'suffix' | 'prefix'): LegalFormEntry | undefined {
  const index = legalFormIndex();
  if (position === 'suffix') return index.entries.get(key);
  let node: TrieNode | undefined = index.prefix;
  for (let k = 0; k < key.length && node; k++) node = node.next?.get(key.charCodeAt(k));
  return node?.entry;
}

function countryOf(jurisdiction: string): string {
  const dash = jurisdiction.indexOf('-');
  return dash < 0 ? jurisdiction : jurisdiction.slice(0, dash);
}

function buildIndex(table: RawTable): LegalFormIndex {
  const suffix: TrieNode = { next: undefined, entry: undefined };
  const prefix: TrieNode = { next: undefined, entry: undefined };
  const entries = new Map<string, LegalFormEntry>();
  for (const [key, value] of Object.entries(table.forms)) {
    const [family = key, kinds = '', codeList = ''] = value;
    const codes = codeList.split(' ').filter((c) => c !== '');
    const jurisdictions = codes.map((c) => table.codes[c] ?? '');
    const entry: LegalFormEntry = {
      key,
      family,
      abbreviation: kinds.includes('a'),
      name: kinds.includes('n'),
      codes,
      jurisdictions,
      distinctJurisdictions: [...new Set(jurisdictions)],
    };
    entries.set(key, entry);
    if (key.length < MIN_KEY_LENGTH) continue;
    insert(suffix, key, entry, true);
    const prefixCodes = codes.filter((_, i) => isPrefixJurisdiction(entry.jurisdictions[i] ?? '', entry.name));
    if (prefixCodes.length > 0) {
      const prefixJurisdictions = prefixCodes.map((c) => table.codes[c] ?? '');
      const prefixEntry = { ...entry, codes: prefixCodes, jurisdictions: prefixJurisdictions, distinctJurisdictions: [...new Set(prefixJurisdictions)] };
      insert(prefix, key, prefixEntry, false);
    }
  }
  const inactive = new Set(table.inactive);
  return { suffix, prefix, entries, inactive, jurisdictionOf: (code) => table.codes[code] };
}

function insert(root: TrieNode, key: string, entry: LegalFormEntry, reversed: boolean): void {
  let node = root;
  for (let k = 0; k < key.length; k++) {
    const unit = key.charCodeAt(reversed ? key.length - 1 - k : k);
    node.next ??= new Map();
    let child = node.next.get(unit);
    if (!child) {
      child = { next: undefined, entry: undefined };
      node.next.set(unit, child);
    }
    node = child;
  }
  node.entry = entry;
}
