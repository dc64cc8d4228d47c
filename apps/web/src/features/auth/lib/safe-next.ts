import { paths } from '../../../config/paths';

// A made-up origin to resolve against: whatever resolves elsewhere would leave the app.
const here = 'https://varden.invalid';

// Going "next" to these would only loop back to a form the person has just used, or (the root)
// to the role's home, where signing in leads anyway.
const pointless = new Set<string>([paths.home.path, paths.signIn.path, paths.resetPassword.path, paths.setPassword.path]);

/**
 * The path to go to after signing in, from `?next=`, or undefined when it is missing or would
 * lead anywhere but a page of this app (an open redirect: `//evil.example`, `/\evil`, `https:`).
 */
export function safeNext(next: string | null | undefined): string | undefined {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return undefined;
  let url: URL;
  try {
    url = new URL(next, here);
  } catch {
    return undefined;
  }
  if (url.origin !== here || pointless.has(url.pathname)) return undefined;
  return url.pathname + url.search + url.hash;
}
