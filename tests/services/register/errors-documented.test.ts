/** docs/register.md names the register's error codes in its public interface: the list stays the catalogue's. */
import { readFileSync } from 'node:fs';
import { expect, it } from 'vitest';
import { REGISTER_ERROR_CODES } from '../../../services/register/errors.ts';

const DOC = readFileSync(new URL('../../../docs/register.md', import.meta.url), 'utf8');

it('lists every code of REGISTER_ERROR_CODES in docs/register.md, and no other', () => {
  const list = /Errors are `RegisterError` with a stable `code`\s*\(([^)]*)\)/.exec(DOC);
  expect(list, 'docs/register.md: the sentence "Errors are `RegisterError` with a stable `code` (…)"').not.toBeNull();
  const listed = [...list![1]!.matchAll(/`([A-Z_]+)`/g)].map((m) => m[1]);
  expect(listed.sort()).toEqual(Object.keys(REGISTER_ERROR_CODES).sort());
});
