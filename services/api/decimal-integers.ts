/**
 * Integers in the query string and the path are written in plain decimal digits. ajv's type coercion reads any text
 * JavaScript's Number() reads, so "0x1", "1e0", "1.0", "+1", " 1" and "01" all named id 1 (and `limit=1e2` a page of
 * 100): one resource under many spellings, which a cache, a log search or an audit trail keyed by URL would not join.
 * This check runs on the raw text before ajv coerces it, and refuses another spelling as a type error naming the
 * parameter (422), as ajv would for text that is no number at all.
 */
import type { ErrorObject, ValidateFunction } from 'ajv';

const DECIMAL = /^-?(?:0|[1-9]\d*)$/;

interface PartSchema {
  properties?: Record<string, { type?: string | string[] }>;
}

const isInteger = (type: string | string[] | undefined): boolean => type === 'integer' || (Array.isArray(type) && type.includes('integer'));

/** The validator of a query-string, path or header schema, refusing integers not written in decimal digits first. */
export function withDecimalIntegers(validate: ValidateFunction, schema: object): ValidateFunction {
  const names = Object.entries((schema as PartSchema).properties ?? {})
    .filter(([, field]) => isInteger(field.type))
    .map(([name]) => name);
  if (names.length === 0) return validate;
  const wrapped = ((data: unknown) => {
    const errors: ErrorObject[] = [];
    if (data !== null && typeof data === 'object') {
      for (const name of names) {
        const raw = (data as Record<string, unknown>)[name];
        const texts = Array.isArray(raw) ? raw : [raw];
        if (texts.some((text) => typeof text === 'string' && !DECIMAL.test(text))) {
          errors.push({
            instancePath: `/${name.replaceAll('~', '~0').replaceAll('/', '~1')}`,
            schemaPath: `#/properties/${name}/type`,
            keyword: 'format',
            params: { format: 'decimal integer' },
            message: 'must be an integer written in decimal digits (no sign +, point, exponent, hex, space or leading zero)',
          });
        }
      }
    }
    if (errors.length > 0) {
      wrapped.errors = errors;
      return false;
    }
    const ok = validate(data);
    wrapped.errors = validate.errors;
    return ok;
  }) as ValidateFunction;
  return wrapped;
}
