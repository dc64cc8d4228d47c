import { passwordLength } from '@varden/schemas';
import { isCommonPassword } from './common-passwords';

/**
 * NIST SP 800-63B 3.1.1.2: a length floor and ceiling, no composition rules, and refusal of
 * passwords found in a list of commonly used, repetitive or sequential values, or taken from the
 * context (the account's own e-mail). Returns the message for the field, or undefined when fine.
 */
export function passwordProblem(password: string, email: string): string | undefined {
  const normalised = password.normalize('NFKC');
  const length = [...normalised].length;
  if (length < passwordLength.min) return `Use at least ${passwordLength.min} characters. A phrase of a few words is easy to remember.`;
  if (length > passwordLength.max) return `Use at most ${passwordLength.max} characters.`;
  const lower = normalised.toLowerCase();
  const address = email.trim().toLowerCase();
  const localPart = address.split('@')[0] ?? '';
  if (lower === address || lower === localPart) return 'Do not use your e-mail address as the password.';
  if (isCommonPassword(normalised)) {
    return 'This password is on a list of commonly used passwords. Choose a phrase of your own.';
  }
  if (isRepetitive(lower) || isSequential(lower)) {
    return 'This password is a repeated or sequential pattern. Choose a phrase of your own.';
  }
  return undefined;
}

/** The whole password is one short unit (up to 4 characters) repeated, e.g. "abab…", "1231…". */
function isRepetitive(value: string): boolean {
  const chars = [...value];
  for (let unit = 1; unit <= 4; unit++) {
    if (chars.every((c, i) => c === chars[i % unit])) return true;
  }
  return false;
}

/** Every character follows the previous one up or down by one code point ("abcd…", "9876…"). */
function isSequential(value: string): boolean {
  const points = [...value].map((c) => c.codePointAt(0) ?? 0);
  const steps = points.slice(1).map((p, i) => p - (points[i] ?? 0));
  return steps.every((s) => s === 1) || steps.every((s) => s === -1);
}
