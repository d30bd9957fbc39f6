import { changePasswordRequestSchema, newPasswordSchema } from '../api/new-password';
import { newPasswordProblem } from './password-strength';

// OWASP ASVS 4.0.3 §2.1.1 (12 characters at least), §2.1.7 (breached and common passwords
// refused), §2.1.9 (no composition rules); the list is @zxcvbn-ts/language-common's.
describe('newPasswordProblem', () => {
  it.each([
    ['aaaaaaaaaaaa', /repeats/],
    ['123456789012', /common and breached/],
    ['password1234', /common and breached/],
    ['qwertyuiopas', /common and breached/],
    ['short', /at least 12 characters/],
    ['            ', /only spaces/],
  ])('refuses %j', (password, sentence) => {
    expect(newPasswordProblem(password)).toMatch(sentence);
  });

  it('refuses a password built on the person’s own address or name', () => {
    expect(newPasswordProblem('kestrelfen2026', ['pilot@kestrelfen.example', 'Pat Pilot'])).toMatch(/own name or e-mail/);
  });

  it('accepts long passphrases and long mixed passwords without composition rules', () => {
    for (const password of ['tailwind-quiet-harbour', 'correct horse battery staple', 'brand-new-password-2026', 'Sup3rS3cure!Pass']) {
      expect(newPasswordProblem(password)).toBeNull();
    }
  });

  it('is the rule of the shared schemas the forms and the server use', () => {
    expect(newPasswordSchema.safeParse('aaaaaaaaaaaa').success).toBe(false);
    const change = changePasswordRequestSchema.safeParse({ currentPassword: 'x', newPassword: 'aaaaaaaaaaaa' });
    expect(change.error?.issues[0]?.path).toEqual(['newPassword']);
  });
});
