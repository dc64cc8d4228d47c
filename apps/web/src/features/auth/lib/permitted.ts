import type { Permission } from '@varden/schemas';
import { hasPermission, type SessionResponse } from '../api/session-queries';

/** The entries (rail sections, starting points) the signed-in person may use; no permission means anyone signed in. */
export function permitted<T extends { permission?: Permission }>(entries: readonly T[], sessionData: SessionResponse | null | undefined): T[] {
  if (!sessionData) return [];
  return entries.filter((entry) => entry.permission === undefined || hasPermission(sessionData, entry.permission));
}
