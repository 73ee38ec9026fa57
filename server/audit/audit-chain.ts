import { createHash } from 'node:crypto';

/** The hash before the first event. */
export const GENESIS_HASH = '0'.repeat(64);

/** The stored fields of an event that its hash covers. */
export interface ChainedFields {
  id: number;
  at: number;
  actorId: number | null;
  action: string;
  budgetId: number | null;
  versionNumber: number | null;
  /** The detail exactly as stored (JSON text). */
  detail: string;
}

/**
 * SHA-256 (hex) of the previous event's hash, a line feed and the canonical serialization of
 * the event: the JSON array [id, at, actorId, action, budgetId, versionNumber, detail] (fixed
 * order, detail as its stored text). Changing, removing or inserting any event changes the hash
 * of every later one.
 */
export function chainHash(previous: string, e: ChainedFields): string {
  const canonical = JSON.stringify([e.id, e.at, e.actorId, e.action, e.budgetId, e.versionNumber, e.detail]);
  return createHash('sha256').update(`${previous}\n${canonical}`).digest('hex');
}
