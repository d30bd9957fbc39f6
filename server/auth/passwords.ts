import * as argon2 from 'argon2';

/**
 * argon2id with the library's defaults (m = 64 MiB, t = 3, p = 4), which meet OWASP's
 * current minimum for argon2id.
 */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

export async function verifyPassword(hash: string | null, password: string): Promise<boolean> {
  if (!hash) return false;
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

/** A hash of a random string, compared against when the e-mail is unknown so timing does not tell. */
let decoyHash: Promise<string> | undefined;
export function decoyPasswordHash(): Promise<string> {
  decoyHash ??= hashPassword(`decoy-${Math.random()}`);
  return decoyHash;
}
