import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

let list: ReadonlySet<string> | undefined;

/**
 * The passwords shipped in common-passwords.txt (one a line, lower case, '#' starts a comment),
 * read once on first use.
 */
export function commonPasswords(): ReadonlySet<string> {
  list ??= new Set(
    readFileSync(fileURLToPath(new URL('./common-passwords.txt', import.meta.url)), 'utf8')
      .split('\n')
      .map((line) => line.trim())
      .filter((line) => line.length > 0 && !line.startsWith('#')),
  );
  return list;
}

/** Case-insensitive, after the same NFKC normalisation the hashing applies. */
export function isCommonPassword(password: string): boolean {
  return commonPasswords().has(password.normalize('NFKC').toLowerCase());
}
