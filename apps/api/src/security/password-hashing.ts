import { Argon2id } from 'oslo/password';
import { generateRandomString, alphabet } from 'oslo/crypto';

// oslo's defaults (19 MiB, 2 passes, 1 lane) are OWASP's recommended Argon2id parameters.
const argon2id = new Argon2id();

export function hashPassword(password: string): Promise<string> {
  return argon2id.hash(password);
}

export function verifyPassword(hash: string, password: string): Promise<boolean> {
  return argon2id.verify(hash, password);
}

let dummyHash: Promise<string> | undefined;

/**
 * Checks a password against a hash of nothing anyone knows, so a sign-in for an unknown e-mail
 * costs as much time as one for a real account and the answer time reveals nothing.
 */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= argon2id.hash(generateRandomString(32, alphabet('a-z', 'A-Z', '0-9')));
  await argon2id.verify(await dummyHash, password);
  return false;
}
