/**
 * The explanations a ChangeSet stored or read, by id, as jsonb keeps them (db/queries/explanations.ts). Not state
 * rows: like the history they are never changed, so they record no op; a new one is written with the buffer.
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { explanationBodies } from '../../../db/queries/explanations.ts';
import type { Row } from './tables.ts';

export class Explanations {
  private readonly bodies = new Map<number, Row>();

  constructor(private readonly trx: Transaction<Database>) {}

  /** One this ChangeSet stores (its body as jsonb will keep it). */
  keep(id: number, body: Row): void {
    this.bodies.set(id, body);
  }

  /** The body of an explanation: one kept here, else read now. */
  async body(id: number): Promise<Row | undefined> {
    if (!this.bodies.has(id)) for (const [key, body] of await explanationBodies(this.trx, [id])) this.bodies.set(key, body);
    return this.bodies.get(id);
  }
}
