/** Keyset paging for the /v1 lists: opaque cursors and one page of items. */
import { ApiError } from '../../errors.ts';

/** Opaque cursors: base64url of the last id seen. */
export function encodeCursor(lastId: number): string {
  return Buffer.from(`i${lastId}`, 'utf8').toString('base64url');
}

export function decodeCursor(cursor: string | undefined, name = 'cursor'): number {
  if (cursor === undefined || cursor === '') return 0;
  const text = Buffer.from(cursor, 'base64url').toString('utf8');
  const match = /^i(\d{1,15})$/.exec(text);
  if (!match) {
    throw new ApiError('VALIDATION_FAILED', `${name} is not a cursor this service gave out`, {
      errors: [{ pointer: `/${name}`, message: 'is not a cursor this service gave out', in: 'query' }],
    });
  }
  return Number(match[1]);
}

export function page<T extends { id: number }>(items: T[], limit: number): { items: T[]; nextCursor: string | null } {
  const more = items.length > limit;
  const shown = more ? items.slice(0, limit) : items;
  return { items: shown, nextCursor: more ? encodeCursor(shown[shown.length - 1]!.id) : null };
}
