/**
 * From a file row to a mention: which column feeds which field (`--map field=column`, else the column named
 * like the field), and the row's identity: its mapped external id, or — without one — a hash of the source and
 * the row's content. So an edited row WITHOUT an id is a new row (a new mention), while an edited row with an
 * id updates its mention (docs/api.md, "Batch ingest").
 */
import { createHash } from 'node:crypto';
import { mentionKey, IDENTIFIER_SCHEMES, type IdentifierScheme, type MentionInput } from '../../resolvers/vocabulary.ts';
import { schemeOfRegistrationNumber, schemeOfTaxId } from '../../resolvers/identifiers/index.ts';

export const MENTION_FIELDS = [
  'externalId',
  'text',
  'contract',
  'contractSource',
  'role',
  'country',
  'address',
  'identifiers',
  'taxId',
  'registrationNumber',
  'source',
] as const;
export type MentionField = (typeof MENTION_FIELDS)[number];

/** Column names recognised without --map (compared lower-case without spaces, _ and -). */
const DEFAULT_COLUMNS: Record<MentionField, string[]> = {
  externalId: ['externalid', 'id', 'mentionid', 'rowid'],
  text: ['text', 'name', 'party', 'partyname'],
  contract: ['contractexternalid', 'contract', 'contractid'],
  contractSource: ['contractsource'],
  role: ['role'],
  country: ['country', 'jurisdiction'],
  address: ['address'],
  identifiers: ['identifiers'],
  // The scheme of these is told per value (schemeOfTaxId / schemeOfRegistrationNumber), as reconcile does.
  taxId: ['taxid', 'vat', 'vatid', 'vatnumber', 'taxnumber'],
  registrationNumber: ['registrationno', 'registrationnumber', 'companynumber', 'regno'],
  source: ['source'],
};

/** Header words that suggest a column holds a row's own id when it is not read as one. */
const ID_LIKE = /(?:id|ref|reference|no|number|key|code)$/;

export type FieldMap = Partial<Record<MentionField | IdentifierScheme, string>>;

export class MappingError extends Error {}

function squash(name: string): string {
  return name.toLowerCase().replace(/[\s_-]+/g, '');
}

/** Parses repeated `--map field=column` options; fields are mention fields or identifier schemes. */
export function parseMapOptions(options: readonly string[]): FieldMap {
  const map: FieldMap = {};
  for (const option of options) {
    const at = option.indexOf('=');
    if (at <= 0 || at === option.length - 1) throw new MappingError(`--map ${option}: expected field=column, e.g. --map text=Party`);
    const field = option.slice(0, at).trim();
    const column = option.slice(at + 1).trim();
    const known = [...MENTION_FIELDS, ...IDENTIFIER_SCHEMES] as readonly string[];
    if (!known.includes(field))
      throw new MappingError(
        `--map ${option}: unknown field "${field}"; fields: ${MENTION_FIELDS.join(', ')}, or an identifier scheme (${IDENTIFIER_SCHEMES.join(', ')})`,
      );
    map[field as MentionField] = column;
  }
  return map;
}

/** Completes a map from the header; checks that every mapped column exists and that text is mapped. */
export function resolveColumns(header: readonly string[], map: FieldMap): FieldMap {
  const out: FieldMap = { ...map };
  for (const [field, column] of Object.entries(map)) {
    if (!header.includes(column!)) throw new MappingError(`--map ${field}=${column}: the file has no column "${column}"; its columns: ${header.join(', ')}`);
  }
  for (const field of MENTION_FIELDS) {
    if (out[field] !== undefined) continue;
    const found = header.find((h) => DEFAULT_COLUMNS[field].includes(squash(h)));
    if (found !== undefined) out[field] = found;
  }
  if (out.text === undefined) throw new MappingError(`no column for the party name: add --map text=<column>; the file's columns: ${header.join(', ')}`);
  return out;
}

/**
 * What the file's header leaves unread, in words for a warning: columns no field reads (named, so that nothing is
 * dropped silently), and a missing id column (rows then get ids from their content, so a re-sent row with another
 * text becomes a new mention instead of an update), naming the columns that look like ids.
 */
export function columnWarnings(header: readonly string[], columns: FieldMap): string[] {
  const read = new Set(Object.values(columns));
  const unread = header.filter((h) => h !== '' && !read.has(h));
  const warnings: string[] = [];
  if (unread.length > 0) {
    warnings.push(
      `${unread.length === 1 ? 'column' : `${unread.length} columns`} not read: ${unread.map((h) => `"${h}"`).join(', ')} ` +
        `(to read one, --map <field>=<column>; fields: ${MENTION_FIELDS.join(', ')}, or an identifier scheme such as lei)`,
    );
  }
  if (columns.externalId === undefined) {
    const idLike = unread.filter((h) => ID_LIKE.test(squash(h)) && !DEFAULT_COLUMNS.contract.includes(squash(h)));
    warnings.push(
      'no column is read as the row id, so each row gets an id made from its content: a row sent again with another text ' +
        `becomes a new mention instead of updating the first${idLike.length > 0 ? `; if ${idLike.map((h) => `"${h}"`).join(' or ')} identifies a row, add --map externalId=${idLike[0]}` : '; add --map externalId=<column> if a column identifies each row'}`,
    );
  }
  return warnings;
}

export type RowResult = { ok: true; mention: MentionInput; identity: string } | { ok: false; reason: string };

/** Identifiers in one cell: `scheme:value` joined by `;` (a label for scheme other as `other/label:value`). */
export function parseIdentifierCell(cell: string): { scheme: string; value: string; label?: string }[] | string {
  const out: { scheme: string; value: string; label?: string }[] = [];
  for (const part of cell.split(';')) {
    const trimmed = part.trim();
    if (trimmed === '') continue;
    const colon = trimmed.indexOf(':');
    if (colon <= 0) return `identifier "${trimmed}" is not scheme:value`;
    const head = trimmed.slice(0, colon);
    const [scheme, label] = head.includes('/') ? [head.slice(0, head.indexOf('/')), head.slice(head.indexOf('/') + 1)] : [head, undefined];
    out.push({ scheme: scheme!, value: trimmed.slice(colon + 1).trim(), ...(label ? { label } : {}) });
  }
  return out;
}

export function rowIdentity(source: string, values: readonly string[]): string {
  return `row-${createHash('sha256')
    .update(JSON.stringify([source, ...values]))
    .digest('hex')
    .slice(0, 32)}`;
}

/** A CSV row (by column) as a mention. */
export function mentionFromRow(row: Record<string, string>, values: readonly string[], columns: FieldMap, source: string): RowResult {
  const get = (field: MentionField | IdentifierScheme): string | undefined => {
    const column = columns[field];
    if (column === undefined) return undefined;
    const value = row[column]?.trim();
    return value === undefined || value === '' ? undefined : value;
  };
  const text = get('text');
  if (text === undefined) return { ok: false, reason: `the name column "${columns.text}" is empty` };
  const rowSource = get('source') ?? source;
  const externalId = get('externalId') ?? rowIdentity(rowSource, values);
  const mention: MentionInput = { source: rowSource, externalId, text };
  const contract = get('contract');
  if (contract !== undefined) mention.contract = { source: get('contractSource') ?? rowSource, externalId: contract };
  const role = get('role');
  if (role !== undefined) mention.role = role;
  const country = get('country');
  if (country !== undefined) mention.country = country.toUpperCase();
  const address = get('address');
  if (address !== undefined) mention.address = address;
  const identifiers: { scheme: string; value: string; label?: string }[] = [];
  const cell = get('identifiers');
  if (cell !== undefined) {
    const parsed = parseIdentifierCell(cell);
    if (typeof parsed === 'string') return { ok: false, reason: `column "${columns.identifiers}": ${parsed}` };
    identifiers.push(...parsed);
  }
  for (const scheme of IDENTIFIER_SCHEMES) {
    const value = get(scheme);
    if (value !== undefined) identifiers.push({ scheme, value });
  }
  // A column that says only "tax id" or "registration number": the scheme is told per value and country; a value
  // whose scheme cannot be told is kept as a labelled `other` identifier (shared, never a strong link).
  const taxId = get('taxId');
  if (taxId !== undefined) identifiers.push(withScheme(schemeOfTaxId(taxId, country), taxId, 'tax id'));
  const registration = get('registrationNumber');
  if (registration !== undefined) identifiers.push(withScheme(schemeOfRegistrationNumber(country), registration, 'registration number'));
  if (identifiers.length > 0) mention.identifiers = identifiers as MentionInput['identifiers'];
  return { ok: true, mention, identity: mentionKey(rowSource, externalId) };
}

function withScheme(scheme: IdentifierScheme | undefined, value: string, label: string): { scheme: string; value: string; label?: string } {
  return scheme ? { scheme, value } : { scheme: 'other', value, label };
}

/** An NDJSON line as a mention: the line is a mention object; source and externalId default as for CSV. */
export function mentionFromJson(value: unknown, line: string, source: string): RowResult {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return { ok: false, reason: 'the line is not a JSON object' };
  const object = value as Record<string, unknown>;
  if (typeof object.text !== 'string' || object.text.trim() === '') return { ok: false, reason: 'text is missing or empty' };
  const rowSource = typeof object.source === 'string' && object.source !== '' ? object.source : source;
  const externalId = typeof object.externalId === 'string' && object.externalId !== '' ? object.externalId : rowIdentity(rowSource, [line]);
  const mention = { ...object, source: rowSource, externalId } as unknown as MentionInput;
  return { ok: true, mention, identity: mentionKey(rowSource, externalId) };
}
