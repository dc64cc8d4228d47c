import { useSyncExternalStore } from 'react';

/**
 * Short messages about things that happened away from where the person is looking (a
 * background refresh failed, a save was refused). Shown by <NoticeArea> in a live region.
 * Errors that belong to a form or a page stay there instead.
 */
export type Notice = { id: number; message: string };

let notices: readonly Notice[] = [];
let nextId = 1;
const listeners = new Set<() => void>();

function emit() {
  for (const listener of listeners) listener();
}

export function pushNotice(message: string): void {
  // The same message twice in a row says nothing new.
  if (notices.some((notice) => notice.message === message)) return;
  notices = [...notices, { id: nextId++, message }].slice(-3);
  emit();
}

export function dismissNotice(id: number): void {
  notices = notices.filter((notice) => notice.id !== id);
  emit();
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

const getSnapshot = () => notices;
/** A page drawn on the server has no notices (the server's own list is never anyone's). */
const none: readonly Notice[] = [];
const getServerSnapshot = () => none;

export function useNotices(): readonly Notice[] {
  return useSyncExternalStore(subscribe, getSnapshot, getServerSnapshot);
}
