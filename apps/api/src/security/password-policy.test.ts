import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { commonPasswords } from './common-passwords';
import { passwordProblem } from './password-policy';

const email = 'ada.quill@example.test';

describe('passwordProblem', () => {
  test('accepts a long passphrase without any composition rule', () => {
    expect(passwordProblem('kettle under the third bench', email)).toBeUndefined();
    expect(passwordProblem('ätherische öle im lager', email)).toBeUndefined();
  });

  test('refuses fewer than 12 characters, counting code points', () => {
    expect(passwordProblem('short phrase', email)).toBeUndefined();
    expect(passwordProblem('short phras', email)).toMatch(/at least 12 characters/);
    // 11 emoji are 22 UTF-16 units but 11 characters.
    expect(passwordProblem('🔌'.repeat(11), email)).toMatch(/at least 12/);
  });

  test('allows up to 256 characters and refuses more', () => {
    const words = 'amber relay quietly hums ';
    expect(passwordProblem(words.repeat(10).slice(0, 256), email)).toBeUndefined();
    expect(passwordProblem(words.repeat(11).slice(0, 257), email)).toMatch(/at most 256/);
  });

  test('refuses passwords on the shipped list, whatever their case', () => {
    expect(passwordProblem('password1234', email)).toMatch(/commonly used/);
    expect(passwordProblem('PassWord1234', email)).toMatch(/commonly used/);
    expect(passwordProblem('Qwertyuiop123', email)).toMatch(/commonly used/);
    expect(passwordProblem('December2024!', email)).toMatch(/commonly used/);
    expect(passwordProblem('P@ssw0rd2019', email)).toMatch(/commonly used/);
  });

  test('refuses the e-mail address or its local part', () => {
    expect(passwordProblem('Ada.Quill@Example.test', email)).toMatch(/e-mail address/);
    expect(passwordProblem('ada.quill.lab@x.test', 'ada.quill.lab@x.test')).toMatch(/e-mail address/);
  });

  test('refuses repeated and sequential patterns', () => {
    expect(passwordProblem('abababababab', email)).toMatch(/repeated or sequential/);
    expect(passwordProblem('zzzzzzzzzzzzzz', email)).toMatch(/repeated or sequential/);
    expect(passwordProblem('lmnopqrstuvw', email)).toMatch(/repeated or sequential/);
    expect(passwordProblem('ponmlkjihgfe', email)).toMatch(/repeated or sequential/);
  });

  test('the shipped list holds thousands of lower-case entries of policy length', () => {
    const list = commonPasswords();
    expect(list.size).toBeGreaterThan(5000);
    for (const entry of list) {
      expect(entry).toBe(entry.toLowerCase());
      expect([...entry].length).toBeGreaterThanOrEqual(12);
    }
  });

  test('every entry on the list is refused', () => {
    const list = [...commonPasswords()];
    fc.assert(
      fc.property(fc.constantFrom(...list), fc.boolean(), (entry, upper) => {
        expect(passwordProblem(upper ? entry.toUpperCase() : entry, email)).toBeDefined();
      }),
    );
  });
});
