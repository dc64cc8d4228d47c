import { passwordLength } from '@varden/schemas';

/** "14 characters" under a new-password field, counted as the policy counts them (code points). */
export function characterCount(value: string | undefined): string {
  const count = [...(value ?? '')].length;
  if (count === 0) return `At least ${passwordLength.min} characters.`;
  const missing = passwordLength.min - count;
  return missing > 0 ? `${count} characters: ${missing} more to go.` : `${count} characters.`;
}
