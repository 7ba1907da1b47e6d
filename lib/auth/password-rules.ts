// What a new password must be: long enough, within bcrypt's 72 bytes (refused, never silently cut), and
// not easy to guess, judged by a zxcvbn estimator with its list of common passwords. Server-side only in
// practice (the word lists are large); the forms check length and bytes and leave the rest to the server.
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH, passwordBytes } from '../validations/user';

/** zxcvbn's scale: 0 too guessable … 4 very unguessable; 3 is "safely unguessable" (about 10^8 guesses or more). */
export const PASSWORD_MIN_SCORE = 3;

let estimator: ZxcvbnFactory | undefined;
const zxcvbn = () => (estimator ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs }));

const COMMON_WARNINGS = new Set(['topTen', 'topHundred', 'common', 'similarToCommon']);

/**
 * Why this password may not be used, or null when it may. `personal` holds the account's own words
 * (name, e-mail address) so a password built from them scores low.
 */
export function passwordProblem(password: string, personal: string[] = []): string | null {
  if (passwordBytes(password) > PASSWORD_MAX_BYTES) {
    return `Passwords can be at most ${PASSWORD_MAX_BYTES} bytes (accented letters and symbols take 2 to 4): use a shorter one.`;
  }
  if ([...password].length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters for your password.`;
  const result = zxcvbn().check(password, personal.filter(Boolean).flatMap((w) => [w, ...w.split(/[^\p{L}\p{N}]+/u)]).filter((w) => w.length >= 3));
  if (result.score >= PASSWORD_MIN_SCORE) return null;
  if (result.feedback.warning && COMMON_WARNINGS.has(result.feedback.warning)) {
    return 'That is one of the most common passwords (or close to one): choose another.';
  }
  return 'That password would be easy to guess: make it longer, for example several unrelated words.';
}
