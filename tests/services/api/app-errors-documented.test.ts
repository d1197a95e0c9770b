import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { ERROR_CATALOGUE, problem, type ErrorCode } from '../../../services/api/errors.ts';
import { REGISTER_TO_API } from '../../../services/api/register-error-codes.ts';
import { toApiError } from '../../../services/api/routes/v1/to-api-error.ts';
import { REGISTER_ERROR_CODES, RegisterError, type RegisterErrorCode } from '../../../services/register/errors.ts';

const DOC = readFileSync(new URL('../../../docs/errors.md', import.meta.url), 'utf8');

/** `## CODE` sections of docs/errors.md with the status each states. */
function documentedCodes(): Map<string, number | undefined> {
  const out = new Map<string, number | undefined>();
  const sections = DOC.split(/^## /m).slice(1);
  for (const section of sections) {
    const [heading = '', ...rest] = section.split('\n');
    const status = /Status (\d{3})/.exec(rest.join('\n'))?.[1];
    out.set(heading.trim(), status ? Number(status) : undefined);
  }
  return out;
}

describe('the error catalogue', () => {
  it('has stable UPPER_SNAKE_CASE codes with an HTTP error status and a title', () => {
    for (const [code, entry] of Object.entries(ERROR_CATALOGUE)) {
      expect(code).toMatch(/^[A-Z][A-Z0-9]*(?:_[A-Z0-9]+)*$/);
      expect(entry.status).toBeGreaterThanOrEqual(400);
      expect(entry.status).toBeLessThan(600);
      expect(entry.title.length).toBeGreaterThan(0);
    }
  });

  it('documents every code in docs/errors.md with the same status, and nothing else', () => {
    const documented = documentedCodes();
    for (const [code, entry] of Object.entries(ERROR_CATALOGUE)) {
      expect(documented.has(code), `docs/errors.md has no section "## ${code}"`).toBe(true);
      expect(documented.get(code), `docs/errors.md gives ${code} another status`).toBe(entry.status);
    }
    expect([...documented.keys()].sort()).toEqual(Object.keys(ERROR_CATALOGUE).sort());
  });

  it('builds RFC 9457 problem documents', () => {
    const body = problem('VALIDATION_FAILED' as ErrorCode, 'the body does not match', [{ pointer: '/text', message: 'is required' }]);
    expect(body).toEqual({
      type: 'urn:cpreg:problem:VALIDATION_FAILED',
      title: ERROR_CATALOGUE.VALIDATION_FAILED.title,
      status: 422,
      detail: 'the body does not match',
      code: 'VALIDATION_FAILED',
      errors: [{ pointer: '/text', message: 'is required' }],
    });
    // Extension members never overwrite the standard ones.
    expect(problem('CONFLICT', 'x', undefined, { status: 200, holder: 3 })).toMatchObject({ status: 409, holder: 3 });
  });

  it('maps every register error code to a catalogue code with the same HTTP status, and nothing else', () => {
    // The type (`satisfies Record<RegisterErrorCode, ErrorCode>`) keeps the map exhaustive; this checks the values.
    expect(Object.keys(REGISTER_TO_API).sort()).toEqual(Object.keys(REGISTER_ERROR_CODES).sort());
    for (const [registerCode, status] of Object.entries(REGISTER_ERROR_CODES)) {
      const apiCode = REGISTER_TO_API[registerCode as RegisterErrorCode];
      expect(Object.hasOwn(ERROR_CATALOGUE, apiCode), `${registerCode} maps to ${apiCode}, not in the catalogue`).toBe(true);
      expect(ERROR_CATALOGUE[apiCode].status, `${registerCode} (${status}) and ${apiCode} differ in status`).toBe(status);
      const answered = toApiError(new RegisterError(registerCode as RegisterErrorCode, 'x'));
      expect([answered.code, answered.status]).toEqual([apiCode, status]);
    }
  });
});
