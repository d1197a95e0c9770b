/**
 * The fixed hostile-input matrix (issue 17): for every live route, the inputs that once answered 500 or were
 * mishandled — NUL, a lone surrogate, integers out of range, deep JSON, a wrong media type, bodies that are not
 * UTF-8 (0xFF, an overlong form, a sequence cut short, CESU-8 surrogate bytes; in the body, and percent-encoded in
 * the query string and the path) or declare another charset, integers
 * not spelled in decimal digits, date-times that are no usable instant, multipart that cannot be read — placed in the query
 * string, each path parameter and the body, each with the answer it must get. Where a route declares a parameter
 * of the right kind (a string to hold the NUL, an integer to overflow) the input goes there, read from
 * /openapi.json; so a new route or parameter is covered without a list. Path parameters not under test hold
 * values that name nothing (ids that do not exist), so that an input refused by mistake for another reason
 * could not change anything either.
 */
import type { LiveRoute } from './support.ts';
import { INSTANT_PATTERN } from '../../services/api/routes/v1/instant-query.ts';

interface Schema {
  type?: string | string[];
  format?: string;
  pattern?: string;
  enum?: unknown[];
  example?: unknown;
  properties?: Record<string, Schema>;
  items?: Schema;
}

interface Operation {
  parameters?: { in: string; name: string; schema?: Schema }[];
  requestBody?: { content?: Record<string, { schema?: Schema }> };
}

export interface OpenApiDoc {
  paths: Record<string, Record<string, Operation>>;
}

export interface HostileCase {
  /** e.g. `query NUL`, `body deep JSON`: what the counts are kept by. */
  kind: string;
  label: string;
  method: string;
  url: string;
  payload?: string | Buffer;
  contentType?: string;
  /**
   * What a correct answer is: the status, one of the codes, a field error at this pointer in this part, and for a
   * body that is not UTF-8 the byte offset it must name.
   */
  expect: { status?: number; codes?: string[]; pointer?: string; in?: 'query' | 'path' | 'body' | 'header'; byteOffset?: number };
}

/** 2^63: one past PostgreSQL's bigint, and far past 2^53 (where JSON integers stop being exact). */
export const OUT_OF_RANGE = '9223372036854775808';
export const DEEP_JSON = `${'['.repeat(20_000)}${']'.repeat(20_000)}`;
const NUL = 'a%00b';
const SURROGATE = 'a%ED%A0%80'; // CESU-8 bytes of U+D800: the only way a lone surrogate travels in a URL

/** Ill-formed UTF-8, one of each kind: the byte values are those Table 3-7 of The Unicode Standard excludes. */
export const NOT_UTF8: readonly [string, readonly number[]][] = [
  ['0xFF', [0xff]],
  ['overlong', [0xc0, 0xaf]],
  ['truncated', [0xe2, 0x82]],
  ['CESU-8 surrogate', [0xed, 0xa0, 0x80]],
];

/**
 * The same ill-formed UTF-8 percent-encoded in a URL, all but the CESU-8 bytes (SURROGATE above): 0xFF, the overlong
 * form of "/" and a three-byte sequence cut short, each between two ASCII letters ("a%FFb").
 */
export const NOT_UTF8_IN_URL: readonly [string, string][] = NOT_UTF8.filter(([name]) => name !== 'CESU-8 surrogate').map(([name, bytes]) => [
  name,
  `a${bytes.map((b) => `%${b.toString(16).toUpperCase().padStart(2, '0')}`).join('')}b`,
]);

/** Integers spelled as JavaScript's Number() reads them but not in plain decimal digits (each meant 1 or 10). */
export const OTHER_SPELLINGS = ['0x1', '1e1', '1.0', '%2B1', '01', '%201'];
/** RFC 3339 date-times that are no usable instant: a leap second (JavaScript's Date refuses it), year 0 in UTC. */
export const UNUSABLE_INSTANTS = ['9999-12-31T23:59:60Z', '0000-01-01T00:00:00Z', '0001-01-01T00:00:00+14:00'];
/** Multipart bodies a parser cannot read: [kind, Content-Type, body]. */
export const MULTIPART_UNREADABLE: readonly [string, string, string][] = [
  ['without boundary', 'multipart/form-data', '--x\r\n'],
  ['not multipart', 'multipart/form-data; boundary=x', 'garbage'],
  ['cut short', 'multipart/form-data; boundary=x', '--x\r\nContent-Disposition: form-data; name="f"; filename="a.txt"\r\n\r\nabc'],
];

const isType = (schema: Schema | undefined, type: string): boolean => schema?.type === type || (Array.isArray(schema?.type) && schema.type.includes(type));

function paramNames(path: string): string[] {
  return [...path.matchAll(/:([A-Z]+)|\*$/gi)].map((m) => m[1] ?? '*');
}

function fill(path: string, values: Record<string, string>): string {
  return path.replace(/:([A-Z]+)/gi, (_, name: string) => values[name]!).replace(/\*$/, () => values['*']!);
}

function operationOf(doc: OpenApiDoc, route: LiveRoute): Operation | undefined {
  return doc.paths[route.path.replace(/:([A-Z]+)/gi, '{$1}')]?.[route.method.toLowerCase()];
}

/** A value for a path parameter that is well-formed but names nothing. */
function placeholder(schema: Schema | undefined): string {
  if (isType(schema, 'integer')) return '999999999';
  if (schema?.enum && schema.enum.length > 0) return String(schema.enum[0]);
  return 'zz-none';
}

/** Integer fields of a body schema with the JSON that overflows each and the pointer it must be named by. */
function integerFields(schema: Schema | undefined): { json: string; pointer: string }[] {
  const out: { json: string; pointer: string }[] = [];
  for (const [name, field] of Object.entries(schema?.properties ?? {})) {
    const key = JSON.stringify(name);
    if (isType(field, 'integer')) out.push({ json: `{${key}:${OUT_OF_RANGE}}`, pointer: `/${name}` });
    else if (isType(field, 'array') && isType(field.items, 'integer')) out.push({ json: `{${key}:[${OUT_OF_RANGE}]}`, pointer: `/${name}/0` });
    else if (isType(field, 'array') && field.items?.properties) {
      for (const [inner, innerSchema] of Object.entries(field.items.properties)) {
        if (isType(innerSchema, 'integer')) out.push({ json: `{${key}:[{${JSON.stringify(inner)}:${OUT_OF_RANGE}}]}`, pointer: `/${name}/0/${inner}` });
      }
    }
  }
  return out;
}

export function hostileMatrix(routes: readonly LiveRoute[], doc: OpenApiDoc): HostileCase[] {
  const cases: HostileCase[] = [];
  for (const route of routes) {
    const op = operationOf(doc, route);
    const params = new Map((op?.parameters ?? []).map((p) => [`${p.in}:${p.name}`, p.schema]));
    const names = paramNames(route.path);
    const base: Record<string, string> = Object.fromEntries(names.map((n) => [n, placeholder(params.get(`path:${n}`))]));
    const url = fill(route.path, base);
    const id = `${route.method} ${route.path}`;
    const add = (kind: string, c: Omit<HostileCase, 'kind' | 'label' | 'method'>): void => {
      cases.push({ kind, label: `${kind} ${id} ${c.url.slice(0, 80)}`, method: route.method, ...c });
    };

    // Query string: every route.
    const queryParams = (op?.parameters ?? []).filter((p) => p.in === 'query');
    const textParam = queryParams.find((p) => isType(p.schema, 'string') && !p.schema?.enum)?.name ?? 'note';
    add('query NUL', { url: `${url}?${textParam}=${NUL}`, expect: { status: 400, codes: ['UNSTORABLE_TEXT'], pointer: `/${textParam}`, in: 'query' } });
    add('query surrogate', {
      url: `${url}?${textParam}=${SURROGATE}`,
      expect: { status: 400, codes: ['UNSTORABLE_TEXT'], pointer: `/${textParam}`, in: 'query' },
    });
    // Any other ill-formed UTF-8 in a query value: the parser would keep it as its raw percent-text, as it did CESU-8.
    for (const [name, encoded] of NOT_UTF8_IN_URL) {
      add(`query not UTF-8 (${name})`, {
        url: `${url}?${textParam}=${encoded}`,
        expect: { status: 400, codes: ['UNSTORABLE_TEXT'], pointer: `/${textParam}`, in: 'query' },
      });
    }
    for (const p of queryParams.filter((q) => isType(q.schema, 'integer'))) {
      add('query out-of-range integer', {
        url: `${url}?${p.name}=${OUT_OF_RANGE}`,
        expect: { status: 422, codes: ['VALIDATION_FAILED'], pointer: `/${p.name}`, in: 'query' },
      });
      // Number() reads "1e1" as 10: once taken as a page of 10, now refused (decimal digits only).
      for (const spelling of OTHER_SPELLINGS) {
        add('query integer spelled otherwise', {
          url: `${url}?${p.name}=${spelling}`,
          expect: { status: 422, codes: ['VALIDATION_FAILED'], pointer: `/${p.name}`, in: 'query' },
        });
      }
    }
    // An instant JavaScript cannot read (a leap second) or in year 0 once reached the database and answered 500.
    for (const p of queryParams.filter((q) => q.schema?.format === 'date-time' || q.schema?.pattern === INSTANT_PATTERN)) {
      for (const instant of UNUSABLE_INSTANTS) {
        add('query date-time out of range', {
          url: `${url}?${p.name}=${encodeURIComponent(instant)}`,
          expect: { status: 422, codes: ['VALIDATION_FAILED'], pointer: `/${p.name}`, in: 'query' },
        });
      }
    }

    // Path: each parameter in turn.
    for (const name of names) {
      const at = (value: string) => fill(route.path, { ...base, [name]: value });
      add('path NUL', { url: at(NUL), expect: { status: 400, codes: ['UNSTORABLE_TEXT'], pointer: `/${name}`, in: 'path' } });
      add('path surrogate', { url: at(SURROGATE), expect: { status: 400, codes: ['BAD_REQUEST', 'UNSTORABLE_TEXT'] } });
      for (const [kind, encoded] of NOT_UTF8_IN_URL) {
        add(`path not UTF-8 (${kind})`, { url: at(encoded), expect: { status: 400, codes: ['BAD_REQUEST', 'UNSTORABLE_TEXT'] } });
      }
      const integer = isType(params.get(`path:${name}`), 'integer');
      // A text parameter (a key id, a file under /console/) takes the digits as text: it names nothing (4xx).
      add('path out-of-range integer', {
        url: at(OUT_OF_RANGE),
        expect: integer ? { status: 422, codes: ['VALIDATION_FAILED'], pointer: `/${name}`, in: 'path' } : {},
      });
      // "0x1", "1e0", "01"… all named id 1: one resource under many URLs. Refused by name.
      if (integer) {
        for (const spelling of OTHER_SPELLINGS) {
          add('path integer spelled otherwise', { url: at(spelling), expect: { status: 422, codes: ['VALIDATION_FAILED'], pointer: `/${name}`, in: 'path' } });
        }
      }
    }

    // Body: every route that reads one (fastify reads no body on GET).
    if (route.method === 'GET') continue;
    const schema = op?.requestBody?.content?.['application/json']?.schema;
    const textField = Object.entries(schema?.properties ?? {}).find(([, f]) => isType(f, 'string'))?.[0];
    const unstorable = (text: string, kind: string): void => {
      const payload = textField ? JSON.stringify({ [textField]: text }) : JSON.stringify({ [text]: 1 });
      const pointer = textField ? `/${textField}` : '/a?b';
      add(kind, { url, payload, expect: { status: 400, codes: ['UNSTORABLE_TEXT'], pointer, in: 'body' } });
    };
    unstorable('a\u0000b', 'body NUL');
    unstorable('a\uD800b', 'body surrogate');
    const ints = integerFields(schema);
    if (ints.length === 0) {
      // No integer field to overflow: sent as an extra field, refused as unknown or as naming nothing.
      add('body out-of-range integer', { url, payload: `{"id":${OUT_OF_RANGE}}`, expect: {} });
    }
    for (const [i, field] of ints.entries()) {
      // Counted once per route (the first field) so that the per-kind count is the route count; the others too.
      add(i === 0 ? 'body out-of-range integer' : 'body out-of-range integer (more fields)', {
        url,
        payload: field.json,
        expect: { status: 422, codes: ['VALIDATION_FAILED'], pointer: field.pointer, in: 'body' },
      });
    }
    // Bytes that are not UTF-8 inside a JSON string (Unicode Table 3-7): refused with the offset, never read as U+FFFD.
    for (const [name, bytes] of NOT_UTF8) {
      const head = Buffer.from(`{${JSON.stringify(textField ?? 'note')}:"ab`);
      add(`body not UTF-8 (${name})`, {
        url,
        payload: Buffer.concat([head, Buffer.from(bytes), Buffer.from('c"}')]),
        expect: { status: 400, codes: ['BODY_NOT_UTF8'], byteOffset: head.length },
      });
    }
    add('body charset latin1', {
      url,
      payload: '{}',
      contentType: 'application/json; charset=latin1',
      expect: { status: 415, codes: ['UNSUPPORTED_MEDIA_TYPE'], pointer: '/content-type', in: 'header' },
    });
    // A parameter given twice is an error (RFC 6838 §4.3); the first value was taken, so this body was read as UTF-8.
    add('body charset twice', {
      url,
      payload: '{}',
      contentType: 'application/json; charset=utf-8; charset=latin1',
      expect: { status: 415, codes: ['UNSUPPORTED_MEDIA_TYPE'], pointer: '/content-type', in: 'header' },
    });
    add('body deep JSON', { url, payload: DEEP_JSON, expect: { status: 422, codes: ['BODY_TOO_DEEP'] } });
    add('body wrong media type', { url, payload: 'source=s&text=t', contentType: 'text/plain', expect: { status: 415, codes: ['UNSUPPORTED_MEDIA_TYPE'] } });
    // Multipart that cannot be read, or that holds a form field: a JSON route does not take multipart (415); the
    // upload route once answered 500 (no boundary, bytes that are not multipart, a part cut short) and 413 "reach
    // fields limit" for a field. Now 400 naming what is wrong, and 422 for a field part.
    for (const [name, contentType, payload] of MULTIPART_UNREADABLE) {
      add(`body multipart ${name}`, { url, payload, contentType, expect: { codes: ['UNSUPPORTED_MEDIA_TYPE', 'BAD_REQUEST'] } });
    }
    add('body multipart form field', {
      url,
      payload: '--x\r\nContent-Disposition: form-data; name="source"\r\n\r\nupload\r\n--x--\r\n',
      contentType: 'multipart/form-data; boundary=x',
      expect: { codes: ['UNSUPPORTED_MEDIA_TYPE', 'VALIDATION_FAILED'] },
    });
  }
  return cases;
}
