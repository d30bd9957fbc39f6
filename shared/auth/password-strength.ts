/**
 * Whether a new password is acceptable, one rule for the server and the client's forms.
 *
 * OWASP ASVS 4.0.3 §2.1: at least 12 characters (2.1.1), up to 128 and more allowed (2.1.2, we
 * take 200), no composition rules (2.1.9), and checked against a set of breached passwords
 * (2.1.7). The set is the common-password list of `@zxcvbn-ts/language-common` (shipped inside
 * the product, offline); `@zxcvbn-ts/core` also estimates the guesses an attacker needs, and we
 * refuse fewer than 10^8 (its score 3, "safely unguessable: moderate protection from an offline
 * slow-hash scenario" — argon2id here), which catches `aaaaaaaaaaaa`, `123456789012`, keyboard
 * walks and a name with digits added.
 *
 * The dictionaries are about 1 MB, so the estimator is built on first use; the client imports
 * this file only from its lazily loaded password pages.
 */
import { ZxcvbnFactory, type MatchExtended } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';

export const NEW_PASSWORD_MIN_LENGTH = 12;
export const NEW_PASSWORD_MAX_LENGTH = 200;
/** zxcvbn's score 3 starts at 10^8 guesses. */
export const MIN_PASSWORD_SCORE = 3;

let estimator: ZxcvbnFactory | undefined;
function strengthEstimator(): ZxcvbnFactory {
  estimator ??= new ZxcvbnFactory({ dictionary, graphs: adjacencyGraphs });
  return estimator;
}

/**
 * The sentence that says why `password` may not be chosen, or null when it may.
 *
 * @param personal what the person's own details are (e-mail, name, operator): a password built
 *   on them is guessed first.
 * @example newPasswordProblem('aaaaaaaaaaaa') // 'This password repeats …'
 */
export function newPasswordProblem(password: string, personal: readonly string[] = []): string | null {
  if (password.length < NEW_PASSWORD_MIN_LENGTH) {
    return `Choose a password of at least ${NEW_PASSWORD_MIN_LENGTH} characters; a few unrelated words work well.`;
  }
  if (password.length > NEW_PASSWORD_MAX_LENGTH) return `Keep the password under ${NEW_PASSWORD_MAX_LENGTH} characters.`;
  if (password.trim().length === 0) return 'A password of only spaces is not accepted.';
  const inputs = personal
    .flatMap((text) => [text, ...text.split('@'), text.replace(/[^\p{L}\p{N}]+/gu, ''), ...text.split(/[^\p{L}\p{N}]+/u)])
    .filter((word) => word.length >= 3);
  // NIST SP 800-63B §5.1.1.2: context-specific words (the service, the person's name or address)
  // are refused too; half the password made of them is enough to refuse it.
  if (personalShare(password, inputs) >= 0.5) return 'This password is built on your own name or e-mail address. Choose another; a few unrelated words work well.';
  const result = strengthEstimator().check(password, inputs);
  if (result.score >= MIN_PASSWORD_SCORE) return null;
  return `${weakness(result.sequence)} Choose another; a few unrelated words work well.`;
}

/** The share of the password's characters covered by the person's own words (case ignored). */
function personalShare(password: string, words: readonly string[]): number {
  const lower = password.toLowerCase();
  const covered = new Array<boolean>(lower.length).fill(false);
  for (const word of new Set(words.map((w) => w.toLowerCase()))) {
    for (let at = lower.indexOf(word); at !== -1; at = lower.indexOf(word, at + 1)) covered.fill(true, at, at + word.length);
  }
  return covered.filter(Boolean).length / Math.max(1, lower.length);
}

/** What made the password guessable, from the longest part an attacker would try first. */
function weakness(sequence: readonly MatchExtended[]): string {
  const longest = [...sequence].sort((a, b) => b.token.length - a.token.length)[0];
  switch (longest?.pattern) {
    case 'dictionary': {
      const dictionaryName = 'dictionaryName' in longest ? longest.dictionaryName : '';
      if (dictionaryName === 'userInputs') return 'This password is built on your own name or e-mail address.';
      if (dictionaryName === 'passwords-common') return 'This password is on the list of common and breached passwords.';
      return 'This password is made of a few very common words.';
    }
    case 'repeat':
      return 'This password repeats the same characters.';
    case 'sequence':
      return 'This password is a sequence such as abcd or 1234.';
    case 'spatial':
      return 'This password is a pattern of neighbouring keys.';
    case 'date':
      return 'This password is mostly a date.';
    default:
      return 'This password is too easy to guess.';
  }
}
