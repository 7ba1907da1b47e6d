// New passwords (issue 11): refused past bcrypt's 72 bytes (bcrypt uses only the first 72 bytes of the
// key: Provos & Mazières, "A Future-Adaptable Password Scheme", 1999 — from memory), under 10 characters,
// or when zxcvbn scores them below 3 (the estimator's own scale; its common-password list ships in
// @zxcvbn-ts/language-common).
import { describe, expect, test } from 'vitest';
import { passwordProblem } from '@/lib/auth/password-rules';
import { newPasswordSchema, passwordBytes } from '@/lib/validations/user';

describe('passwordProblem', () => {
  test.each(['password123', 'qwertyuiop', '1234567890', 'iloveyou12345', 'password1234'])('%j is refused as common or guessable', (pw) => {
    expect(passwordProblem(pw)).toMatch(/common|easy to guess/);
  });

  test.each(['lathe spigot recess fit', 'knurled brass thumb screw', 'Tr0ub4dour&3-cast-iron'])('%j is accepted', (pw) => {
    expect(passwordProblem(pw)).toBeNull();
  });

  test('73 bytes are refused even when made of strong characters; 72 are not', () => {
    const seventyTwo = 'é'.repeat(35) + 'xy'; // 70 + 2 bytes
    const seventyThree = 'é'.repeat(36) + 'x'; // 72 + 1 bytes
    expect(passwordBytes(seventyTwo)).toBe(72);
    expect(passwordBytes(seventyThree)).toBe(73);
    expect(passwordProblem(seventyThree)).toMatch(/72 bytes/);
    expect(passwordProblem(seventyTwo)).not.toMatch(/72 bytes/);
    expect(newPasswordSchema.safeParse(seventyThree).success).toBe(false);
    expect(newPasswordSchema.safeParse(seventyTwo).success).toBe(true);
  });

  test('a password made of the account’s own name is refused', () => {
    expect(passwordProblem('marenholt1', ['Maren Holt', 'maren@example.test'])).toMatch(/easy to guess/);
  });

  test('fewer than 10 characters is refused', () => {
    expect(passwordProblem('k9#Lm2!q')).toMatch(/at least 10/);
  });
});
