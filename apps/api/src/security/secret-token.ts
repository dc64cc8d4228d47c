import { createHash } from 'node:crypto';
import { alphabet, generateRandomString } from 'oslo/crypto';

const tokenAlphabet = alphabet('a-z', 'A-Z', '0-9');

/** 40 characters of 62 symbols: about 238 bits from the system's CSPRNG. */
export function generateSecretToken(): string {
  return generateRandomString(40, tokenAlphabet);
}

/**
 * What the database keeps instead of the token. A token has far more entropy than a password,
 * so a fast unsalted SHA-256 is enough and lets the lookup use a unique index.
 */
export function hashSecretToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
