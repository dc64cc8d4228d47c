import { workOrder } from '@varden/schemas';
import { outcomeOf } from './answer-outcome';
import type { OutboxItem, PhotoPayload, SendOutcome } from './outbox-types';

/** Longest wait for one answer: a switch-room's last bar of signal can hang a request. */
const jsonTimeoutMs = 30_000;
const photoTimeoutMs = 180_000;

function parseBody(text: string): unknown {
  if (text === '') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

async function postJson(path: string, body: unknown): Promise<{ status: number; body: unknown }> {
  try {
    const response = await fetch(path, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
      signal: AbortSignal.timeout(jsonTimeoutMs),
    });
    return { status: response.status, body: parseBody(await response.text()) };
  } catch {
    return { status: 0, body: undefined };
  }
}

/** Multipart upload through XMLHttpRequest, whose upload.onprogress fetch does not have. */
function postPhoto(orderId: number, photo: PhotoPayload, onProgress: (fraction: number) => void): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve) => {
    const form = new FormData();
    form.append('idempotencyKey', photo.idempotencyKey);
    form.append('caption', photo.caption);
    if (photo.target && photo.targetId !== undefined) {
      form.append('target', photo.target);
      form.append('targetId', String(photo.targetId));
    }
    // The file last: multer reads the fields before it streams the file.
    form.append('file', photo.file, photo.fileName);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/work-orders/${orderId}/photos`);
    xhr.withCredentials = true;
    xhr.timeout = photoTimeoutMs;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => resolve({ status: xhr.status, body: parseBody(xhr.responseText) });
    xhr.onerror = () => resolve({ status: 0, body: undefined });
    xhr.ontimeout = () => resolve({ status: 0, body: undefined });
    xhr.onabort = () => resolve({ status: 0, body: undefined });
    xhr.send(form);
  });
}

/**
 * A move the phone made offline may have reached the server before the answer was lost: the
 * retry then meets a 409 for an order already in that state, which means it was done.
 */
async function alreadyMoved(orderId: number, to: string): Promise<boolean> {
  try {
    const response = await fetch(`/api/work-orders/${orderId}`, { credentials: 'same-origin', headers: { Accept: 'application/json' } });
    if (!response.ok) return false;
    const parsed = workOrder.safeParse(await response.json());
    return parsed.success && parsed.data.state === to;
  } catch {
    return false;
  }
}

/** One try to send an outbox item to the API. Never throws: every failure is an outcome. */
export async function sendOutboxItem(item: OutboxItem, onProgress: (fraction: number) => void): Promise<SendOutcome> {
  const { payload, orderId } = item;
  switch (payload.kind) {
    case 'reading': {
      const answer = await postJson(`/api/work-orders/${orderId}/readings`, payload.input);
      return outcomeOf(answer.status, answer.body);
    }
    case 'photo': {
      const answer = await postPhoto(orderId, payload, onProgress);
      return outcomeOf(answer.status, answer.body);
    }
    case 'transition': {
      const answer = await postJson(`/api/work-orders/${orderId}/transitions`, { to: payload.to, version: payload.version, comment: payload.comment });
      if (answer.status === 409 && (await alreadyMoved(orderId, payload.to))) return { kind: 'sent', status: 200, body: undefined };
      return outcomeOf(answer.status, answer.body);
    }
  }
}
