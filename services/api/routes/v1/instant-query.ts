/**
 * A point in time given in a query string (review items' createdBefore / createdAfter): an RFC 3339 date-time
 * with its offset, or a plain ISO 8601 calendar date, read as midnight UTC of that day. A date alone is what
 * people type first ("items older than 2026-01-31"), and a format check that took only date-times refused it.
 * Its UTC year must lie in 1–9999, as for every date-time the service takes.
 */
import { ApiError } from '../../errors.ts';
import { isUsableInstant } from '../../validation.ts';

const DATE = /^\d{4}-\d{2}-\d{2}$/;
const DATE_TIME = /^\d{4}-\d{2}-\d{2}t\d{2}:\d{2}:\d{2}(?:\.\d{1,9})?(?:z|[+-]\d{2}:\d{2})$/i;

/** The shape of both forms, so that the published schema says what is taken (the day and the range are checked below). */
export const INSTANT_PATTERN = '^\\d{4}-\\d{2}-\\d{2}([Tt]\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,9})?([Zz]|[+-]\\d{2}:\\d{2}))?$';

export const INSTANT_QUERY = {
  type: 'string',
  maxLength: 40,
  pattern: INSTANT_PATTERN,
  description: 'an RFC 3339 date-time with its offset (2026-01-31T09:30:00Z) or a date (2026-01-31: midnight UTC)',
  example: '2026-01-31',
} as const;

/** The instant as a date-time string the queries take, or a 422 naming the parameter and both accepted forms. */
export function instantOf(name: string, value: string | undefined): string | undefined {
  if (value === undefined) return undefined;
  const day = value.slice(0, 10);
  const time = DATE.test(value) ? Date.parse(`${value}T00:00:00Z`) : DATE_TIME.test(value) ? Date.parse(value) : NaN;
  // Date.parse rolls 2026-02-30 over to March: a day that does not exist is refused, not moved.
  const realDay = !Number.isNaN(Date.parse(`${day}T00:00:00Z`)) && new Date(`${day}T00:00:00Z`).toISOString().slice(0, 10) === day;
  // PostgreSQL has no year 0: an instant outside years 1–9999 in UTC ("0001-01-01T00:00:00+14:00" is in year 0) once
  // reached the database and answered 500; the same rule as the date-time format's.
  if (!realDay || !isUsableInstant(new Date(time))) {
    const message = `"${value}" is not a date (2026-01-31, read as midnight UTC) or an RFC 3339 date-time with its offset (2026-01-31T09:30:00Z)`;
    throw new ApiError('VALIDATION_FAILED', `the query parameter ${name}: ${message}`, { errors: [{ pointer: `/${name}`, message, in: 'query' }] });
  }
  return new Date(time).toISOString();
}
