/** A short message handed to the next page through router state (after a password is set, after signing out). */
export type LocationNotice = { notice: string; email?: string };

/** Reads a notice from `useLocation().state`, which may hold anything or nothing. */
export function noticeFrom(state: unknown): LocationNotice | undefined {
  if (typeof state !== 'object' || state === null || !('notice' in state) || typeof state.notice !== 'string') return undefined;
  const email = 'email' in state && typeof state.email === 'string' ? state.email : undefined;
  return email === undefined ? { notice: state.notice } : { notice: state.notice, email };
}
