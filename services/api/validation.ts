/**
 * Schema validation of requests. Two ajv instances, because fastify's default coerces types
 * everywhere and drops unknown fields silently:
 * - bodies: no coercion (a number sent as a string is a type error) and unknown fields are errors;
 * - query strings, path parameters and headers: text by nature, so types are coerced (integers only from plain
 *   decimal digits: decimal-integers.ts).
 * ajv errors become RFC 6901 JSON pointers with a message each (the `errors[]` of a 422 problem).
 */
import { Ajv, type ErrorObject, type Options } from 'ajv';
import addFormats from 'ajv-formats';
import { withDecimalIntegers } from './decimal-integers.ts';
import type { FieldError } from './errors.ts';

type HttpPart = 'body' | 'querystring' | 'params' | 'headers';

const COMMON: Options = {
  useDefaults: true,
  allErrors: true, // every field error at once; bodies are bounded by bodyLimit
  removeAdditional: false,
  strict: false, // route schemas carry OpenAPI annotations (example, description) unknown to ajv
};

function makeAjv(options: Options, externalSchemas: unknown): Ajv {
  const ajv = new Ajv({ ...COMMON, ...options });
  // ajv-formats is CommonJS: under Node's ESM loader the default import is module.exports itself.
  const plugin = ((addFormats as unknown as { default?: typeof addFormats }).default ?? addFormats) as (a: Ajv) => Ajv;
  plugin(ajv);
  narrowDateTime(ajv);
  for (const schema of Object.values((externalSchemas ?? {}) as Record<string, object>)) ajv.addSchema(schema);
  return ajv;
}

/**
 * A date-time (RFC 3339, as ajv-formats checks it) that is also an instant the service can compare with: one
 * JavaScript's Date reads (a leap second "23:59:60" it does not) and whose UTC year lies in 1–9999 (PostgreSQL
 * has no year 0; "0001-01-01T00:00:00+14:00" is in year 0 in UTC). Such values once reached the database as
 * "Invalid Date" or year 0 and answered 500; now they are 422 naming the parameter.
 */
function narrowDateTime(ajv: Ajv): void {
  const given = (ajv.formats['date-time'] as { validate?: RegExp | ((text: string) => boolean) } | undefined)?.validate;
  if (!given) return;
  const rfc3339 = typeof given === 'function' ? given : (text: string) => given.test(text);
  ajv.addFormat('date-time', {
    type: 'string',
    validate: (text: string) => {
      return rfc3339(text) && isUsableInstant(new Date(text));
    },
  });
}

/** An instant the service can compare and store: Date reads it and its UTC year lies in 1–9999 (see narrowDateTime). */
export function isUsableInstant(at: Date): boolean {
  const year = at.getUTCFullYear();
  return !Number.isNaN(at.getTime()) && year >= 1 && year <= 9999;
}

/** For fastify's `schemaController.compilersFactory.buildValidator`. */
export function buildValidatorFactory() {
  return (externalSchemas: unknown) => {
    const bodyAjv = makeAjv({ coerceTypes: false }, externalSchemas);
    const textAjv = makeAjv({ coerceTypes: 'array' }, externalSchemas);
    return ({ schema, httpPart }: { schema: object & { $id?: string }; httpPart?: string }) => {
      const ajv = (httpPart as HttpPart | undefined) === 'body' ? bodyAjv : textAjv;
      if (schema.$id) {
        const stored = ajv.getSchema(schema.$id);
        if (stored) return stored;
      }
      const validate = ajv.compile(withSafeIntegers(schema));
      return ajv === bodyAjv ? validate : withDecimalIntegers(validate, schema);
    };
  };
}

/**
 * Every integer a route takes is a safe integer, whatever its schema says: a JSON number beyond 2^53 − 1 is not
 * exact in JavaScript (ids were silently rounded to other ids) and one beyond bigint answered 500 from the driver.
 * An integer schema without a bound gets ±Number.MAX_SAFE_INTEGER. Route schemas are our own, small and acyclic
 * (a $ref is left as it is), so the copy recurses.
 */
export function withSafeIntegers<T>(schema: T, fieldMap = false): T {
  if (Array.isArray(schema)) return schema.map((item: unknown) => withSafeIntegers(item)) as T;
  if (schema === null || typeof schema !== 'object') return schema;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(schema)) {
    // Values (enum, example, default, const) are data, not schemas; in a `properties` map every key is a field name.
    const isData = !fieldMap && (key === 'enum' || key === 'example' || key === 'default' || key === 'const');
    out[key] = isData ? value : withSafeIntegers(value, !fieldMap && (key === 'properties' || key === 'patternProperties'));
  }
  const type = out.type;
  if (type === 'integer' || (Array.isArray(type) && type.includes('integer'))) {
    if (out.maximum === undefined && out.exclusiveMaximum === undefined) out.maximum = Number.MAX_SAFE_INTEGER;
    if (out.minimum === undefined && out.exclusiveMinimum === undefined) out.minimum = -Number.MAX_SAFE_INTEGER;
  }
  return out as T;
}

const PART_TO_IN: Record<string, FieldError['in']> = {
  body: 'body',
  querystring: 'query',
  params: 'path',
  headers: 'header',
};

function escapePointerToken(token: string): string {
  return token.replaceAll('~', '~0').replaceAll('/', '~1');
}

/** A field error with the schema rule it breaks (`required`, `minLength`, …): what a batch item's problem names. */
export type RuleError = FieldError & { rule: string };

/** One body schema compiled as request bodies are (for a route's own validatorCompiler). */
export function compileBodySchema(schema: object) {
  return makeAjv({ coerceTypes: false }, {}).compile(withSafeIntegers(schema));
}

/**
 * A validator for one body schema with the same rules as request bodies (no coercion, unknown fields refused),
 * for a route that checks the items of a batch one by one: the errors of a value, none when it is valid.
 */
export function bodyValidator(schema: object): (value: unknown) => RuleError[] {
  const validate = compileBodySchema(schema);
  return (value) => {
    if (validate(value)) return [];
    const seen = new Set<string>();
    const out: RuleError[] = [];
    for (const error of validate.errors ?? []) {
      const { pointer, message } = describe(error);
      if (seen.has(`${pointer}\u0000${message}`)) continue;
      seen.add(`${pointer}\u0000${message}`);
      out.push({ pointer, message, rule: error.keyword });
    }
    return out;
  };
}

/** One field error per ajv error, pointing at the offending field (not at its parent object). */
export function toFieldErrors(errors: ErrorObject[], part: string | undefined): FieldError[] {
  const where = PART_TO_IN[part ?? 'body'] ?? 'body';
  const seen = new Set<string>();
  const out: FieldError[] = [];
  for (const error of errors) {
    const { pointer, message } = describe(error);
    const key = `${pointer}\u0000${message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push(where === 'body' ? { pointer, message } : { pointer, message, in: where });
  }
  return out;
}

function describe(error: ErrorObject): { pointer: string; message: string } {
  const params = error.params as Record<string, unknown>;
  const base = error.instancePath;
  switch (error.keyword) {
    case 'required':
      return { pointer: `${base}/${escapePointerToken(String(params.missingProperty))}`, message: 'is required' };
    case 'additionalProperties':
      return {
        pointer: `${base}/${escapePointerToken(String(params.additionalProperty))}`,
        message: 'is not an allowed field',
      };
    case 'type':
      return { pointer: base, message: `must be ${String(params.type)}` };
    case 'enum':
      return {
        pointer: base,
        message: `must be one of: ${(params.allowedValues as unknown[]).map(String).join(', ')}`,
      };
    case 'maxLength':
      return { pointer: base, message: `must be at most ${String(params.limit)} characters long` };
    case 'minLength':
      return { pointer: base, message: `must be at least ${String(params.limit)} characters long` };
    case 'maximum':
      return {
        pointer: base,
        message: `must be at most ${String(params.limit)}${params.limit === Number.MAX_SAFE_INTEGER ? ' (2^53 − 1, the largest exact integer)' : ''}`,
      };
    case 'minimum':
      return { pointer: base, message: `must be at least ${String(params.limit)}` };
    case 'maxItems':
      return { pointer: base, message: `must have at most ${String(params.limit)} items` };
    default:
      return { pointer: base, message: error.message ?? `fails the ${error.keyword} rule` };
  }
}
