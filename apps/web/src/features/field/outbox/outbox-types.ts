import type { ReadingInput, WorkOrderState } from '@varden/schemas';

/**
 * The field outbox ("Waiting to send"): everything a technician records is first written to
 * the phone's own storage with its idempotency key, then sent. An item leaves the outbox only
 * once the server has stored it.
 */

export type PhotoTarget = 'capacitor-unit' | 'contactor' | 'reactor' | 'fuse-set' | 'bank';

export type ReadingPayload = { kind: 'reading'; input: ReadingInput };

export type PhotoPayload = {
  kind: 'photo';
  idempotencyKey: string;
  file: Blob;
  fileName: string;
  caption: string;
  target?: PhotoTarget;
  targetId?: number;
};

/** A move of the order that the technician made without signal (the safety card's acknowledgement). */
export type TransitionPayload = { kind: 'transition'; to: WorkOrderState; version: number; comment: string };

export type OutboxPayload = ReadingPayload | PhotoPayload | TransitionPayload;

/** What the server said when it refused an item (a 4xx other than 408/429): shown on the item, not retried blindly. */
export type Refusal = {
  status: number;
  code: string;
  message: string;
  fields: Readonly<Record<string, string>>;
  /** The server found the values implausible and will take them when the technician confirms them. */
  confirmable: boolean;
};

export type OutboxItem = {
  /** The idempotency key: also what the server de-duplicates on. */
  id: string;
  orderId: number;
  /** Place in the outbox; items of an order go out in this order. */
  seq: number;
  /** When the technician recorded it (ISO). */
  createdAt: string;
  /** Words for the technician: "Step 1, unit 2 · capacitance". */
  label: string;
  payload: OutboxPayload;
  /** waiting: not yet stored by the server; refused: the server said no, the technician decides. */
  status: 'waiting' | 'refused';
  attempts: number;
  /** Why the last try did not get through (no signal, server busy), for the item's line. */
  lastFailure: string | null;
  refusal: Refusal | null;
};

/** The answer of one try to send an item. */
export type SendOutcome =
  | { kind: 'sent'; status: number; body: unknown }
  /** No answer, a 5xx, 408 or 429, or a 401 (signed out): keep it and try again later. */
  | { kind: 'retry'; status: number; message: string }
  | { kind: 'refused'; refusal: Refusal };

export type OutboxSnapshot = {
  items: readonly OutboxItem[];
  /** Items being sent right now, with the share uploaded (0…1) where known. */
  sending: ReadonlyMap<string, number | null>;
  online: boolean;
  /** Whether the outbox has been read from the phone's storage yet. */
  loaded: boolean;
};
