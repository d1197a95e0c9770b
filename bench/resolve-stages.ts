/**
 * Where the time of one single resolve goes, seen from outside the register (the service is not changed for it):
 * every statement the database clients send is timed while the bench runs (observeStatements), and one resolve's
 * wall time is cut at its statements into the stages of the batch path (services/register/stage-times.ts):
 *
 *   check   call → first statement (the input checked and analysed, a connection taken);
 *   read    first statement → end of the last statement before the write (stored mention, locks and settings,
 *           candidates and token counts, with the work in Node between them);
 *   decide  that end → the first statement of the write (scoring and the decision, in Node);
 *   write   the first statement that locks rows or draws ids (FOR UPDATE, nextval) after the last plain read → the
 *           first that changes data (a read that also draws ids, as a single resolve's first statement does, is read);
 *   flush   the first statement that changes data (INSERT, UPDATE, DELETE) → the end of the last one (COMMIT);
 *   result  the end of the last statement → the call's return.
 *
 * A resolve that writes nothing (already ingested) has only check, read and the commit. The cut follows the
 * statements' text, so it stays meaningful when the register's statements change, as long as reads come first.
 */
import pg from 'pg';

export interface TimedStatement {
  text: string;
  /** performance.now() when it was sent and when its answer came. */
  start: number;
  end: number;
}

const CHANGES = /\b(?:INSERT\s+INTO|UPDATE\s+\S+\s+SET|DELETE\s+FROM)\b|^\s*commit\b/i;
const LOCKS_OR_IDS = /\bFOR\s+UPDATE\b|\bnextval\s*\(/i;

/** Milliseconds by stage of one resolve that ran from `start` to `end` and sent `statements` (in order). */
export function resolveStages(start: number, end: number, statements: readonly TimedStatement[]): Record<string, number> {
  if (statements.length === 0) return { check: end - start };
  const first = statements[0]!;
  const last = statements[statements.length - 1]!;
  const changeAt = statements.findIndex((s) => CHANGES.test(s.text));
  const change = changeAt === -1 ? statements.length : changeAt;
  // The write begins after the last plain read before the change: an earlier statement may also lock or draw ids
  // (a single resolve's first statement draws the ids of the rows it may add) and is still a read.
  let lastRead = -1;
  for (let i = 0; i < change; i++) if (!LOCKS_OR_IDS.test(statements[i]!.text)) lastRead = i;
  const lockAt = statements.findIndex((s, i) => i > lastRead && i < change && LOCKS_OR_IDS.test(s.text));
  const writeAt = lockAt === -1 ? change : lockAt;
  const stages: Record<string, number> = { check: first.start - start, read: 0, decide: 0, write: 0, flush: 0, result: end - last.end };
  if (writeAt > 0) {
    const lastRead = statements[writeAt - 1]!;
    stages.read = lastRead.end - first.start;
    stages.decide = (statements[writeAt]?.start ?? lastRead.end) - lastRead.end;
  }
  if (writeAt < statements.length) stages.write = (statements[change]?.start ?? last.end) - statements[writeAt]!.start;
  if (change < statements.length) stages.flush = last.end - statements[change]!.start;
  return stages;
}

type QueryFn = (...args: unknown[]) => unknown;

function wrap(proto: { query: QueryFn }, onStatement: (s: TimedStatement) => void): () => void {
  const original = proto.query;
  proto.query = function (this: unknown, ...args: unknown[]) {
    const start = performance.now();
    const answer = original.apply(this, args);
    const first = args[0];
    const text = typeof first === 'string' ? first : String((first as { text?: unknown } | null)?.text ?? '');
    // Only promised answers are timed: a stream (COPY, a cursor) or a callback call passes through untouched.
    if (answer instanceof Promise)
      answer.then(
        () => onStatement({ text, start, end: performance.now() }),
        () => undefined,
      );
    return answer;
  };
  return () => {
    proto.query = original;
  };
}

/** Times every statement sent by pg clients and by PGlite until the returned function is called. */
export async function observeStatements(onStatement: (s: TimedStatement) => void): Promise<() => void> {
  const { PGlite } = await import('@electric-sql/pglite');
  const pgliteBase = Object.getPrototypeOf(PGlite.prototype) as { query: QueryFn };
  const undo = [wrap(pg.Client.prototype as unknown as { query: QueryFn }, onStatement), wrap(pgliteBase, onStatement)];
  return () => undo.forEach((u) => u());
}
